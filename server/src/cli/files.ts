// Expands the paths given on the command line into script files, in a stable order.
import { join, resolve } from 'node:path';
import type { CliFs } from './io';

export const SCRIPT_EXTENSION = '.rungs';

export interface Expanded {
  files: string[];
  missing: string[];
}

export function expandPaths(paths: string[], cwd: string, fs: CliFs): Expanded {
  const files: string[] = [];
  const missing: string[] = [];
  const walk = (dir: string) => {
    for (const name of [...fs.readdir(dir)].sort()) {
      if (name === 'node_modules' || name.startsWith('.')) continue;
      const p = join(dir, name);
      if (fs.isDirectory(p)) walk(p);
      else if (name.endsWith(SCRIPT_EXTENSION)) files.push(p);
    }
  };
  for (const raw of paths) {
    if (raw === '-') {
      files.push('-');
      continue;
    }
    const p = resolve(cwd, raw);
    if (!fs.exists(p)) missing.push(raw);
    else if (fs.isDirectory(p)) walk(p);
    else files.push(p);
  }
  return { files, missing };
}
