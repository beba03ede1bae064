// Expands the paths given on the command line into script files, in a stable order: files as
// named, folders searched for *.rungs, globs (picomatch) matched against *.rungs files below their
// static base. Folder searches skip node_modules, dot-folders and whatever .gitignore files say.
import { dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import ignore, { type Ignore } from 'ignore';
import picomatch from 'picomatch';
import type { CliFs } from './io';

export const SCRIPT_EXTENSION = '.rungs';

export interface Expanded {
  files: string[];
  /** Arguments that named nothing (a missing path, or a glob that matched no script). */
  missing: string[];
}

export interface ExpandOptions {
  /** Honour .gitignore files (default true); explicitly named files are always kept. */
  gitignore?: boolean;
  /** Which file names a folder search keeps (default: names ending in .rungs). */
  match?: (name: string) => boolean;
}

const toPosix = (p: string) => p.split(sep).join('/');

/** .gitignore files from the repository root (a folder holding .git) down to a path's folder. */
class GitIgnores {
  private readonly perDir = new Map<string, Ignore | null>();
  constructor(private readonly fs: CliFs) {}

  private load(dir: string): Ignore | null {
    if (!this.perDir.has(dir)) {
      const file = join(dir, '.gitignore');
      let ig: Ignore | null = null;
      try {
        if (this.fs.exists(file)) ig = ignore().add(this.fs.readFile(file));
      } catch {
        ig = null;
      }
      this.perDir.set(dir, ig);
    }
    return this.perDir.get(dir)!;
  }

  private ancestors(dir: string): string[] {
    const out: string[] = [];
    for (let d = dir; ; d = dirname(d)) {
      out.push(d);
      if (this.fs.exists(join(d, '.git')) || dirname(d) === d) break;
    }
    return out.reverse();
  }

  /** Deeper .gitignore files override shallower ones, and `!pattern` re-includes, as in git. */
  ignored(path: string, isDir: boolean): boolean {
    let state = false;
    for (const d of this.ancestors(dirname(path))) {
      const ig = this.load(d);
      if (!ig) continue;
      const rel = toPosix(relative(d, path)) + (isDir ? '/' : '');
      const t = ig.test(rel);
      if (t.ignored) state = true;
      else if (t.unignored) state = false;
    }
    return state;
  }
}

function compare(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}

export function expandPaths(paths: string[], cwd: string, fs: CliFs, opts: ExpandOptions = {}): Expanded {
  const gitignores = opts.gitignore === false ? null : new GitIgnores(fs);
  const wanted = opts.match ?? ((name: string) => name.endsWith(SCRIPT_EXTENSION));
  const named: string[] = [];
  const found = new Set<string>();
  const missing: string[] = [];
  let stdin = false;
  const real = (p: string) => (fs.realpath ? fs.realpath(p) : p);
  // Folder links can form cycles (two links to "."): each walk enters a real folder once.
  // Pipes and devices named *.rungs are skipped: reading one would block or never end.
  const walk = (dir: string, visit: (file: string) => void, visited = new Set<string>()) => {
    const key = real(dir);
    if (visited.has(key)) return;
    visited.add(key);
    let names: string[];
    try {
      names = [...fs.readdir(dir)].sort(compare);
    } catch {
      return;
    }
    for (const name of names) {
      if (name === 'node_modules' || name.startsWith('.')) continue;
      const p = join(dir, name);
      const isDir = fs.isDirectory(p);
      if (gitignores?.ignored(p, isDir)) continue;
      if (isDir) walk(p, visit, visited);
      else if (wanted(name) && (fs.isFile?.(p) ?? true)) visit(p);
    }
  };
  for (const raw of paths) {
    if (raw === '-') {
      stdin = true;
      continue;
    }
    const scan = picomatch.scan(raw);
    if (scan.isGlob) {
      const base = resolve(cwd, scan.base || '.');
      // Relative globs are matched against paths relative to the working folder, so a cwd with
      // glob characters in its name cannot change what a pattern means.
      const absolute = isAbsolute(raw);
      const match = picomatch(absolute ? toPosix(raw) : toPosix(raw).replace(/^\.\//, ''));
      let n = 0;
      if (fs.isDirectory(base)) {
        walk(base, (f) => {
          if (match(toPosix(absolute ? f : relative(cwd, f)))) {
            found.add(f);
            n++;
          }
        });
      }
      if (!n) missing.push(raw);
      continue;
    }
    const p = resolve(cwd, raw);
    if (!fs.exists(p)) missing.push(raw);
    else if (fs.isDirectory(p)) walk(p, (f) => found.add(f));
    else named.push(p);
  }
  // One file reached by several paths (a linked folder, a file link) is checked (and fixed) once,
  // under the first of its paths in sorted order.
  const byReal = new Map<string, string>();
  for (const f of [...new Set([...named, ...found])].sort(compare)) if (!byReal.has(real(f))) byReal.set(real(f), f);
  const files = [...byReal.values()];
  if (stdin) files.push('-');
  return { files, missing };
}
