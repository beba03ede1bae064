// An in-memory file system behind CliFs and ConfigFs, so commands run in-process on fixtures.
import { dirname, join, resolve } from 'node:path';
import type { CliFs } from '../../server/src/cli/io';

export class MemFs implements CliFs {
  readonly files = new Map<string, string>();
  readonly unreadable = new Set<string>();
  readonly writes: string[] = [];

  constructor(files: Record<string, string> = {}, root = '/clinic') {
    for (const [p, text] of Object.entries(files)) this.files.set(resolve(root, p), text);
  }

  readFile(path: string): string {
    if (this.unreadable.has(path)) throw Object.assign(new Error(`EACCES: ${path}`), { code: 'EACCES' });
    const t = this.files.get(path);
    if (t === undefined) throw Object.assign(new Error(`ENOENT: ${path}`), { code: 'ENOENT' });
    return t;
  }

  writeFile(path: string, text: string): void {
    this.files.set(path, text);
    this.writes.push(path);
  }

  isDirectory(path: string): boolean {
    const prefix = path.endsWith('/') ? path : `${path}/`;
    return [...this.files.keys()].some((f) => f.startsWith(prefix));
  }

  exists(path: string): boolean {
    return this.files.has(path) || this.unreadable.has(path) || this.isDirectory(path);
  }

  readdir(path: string): string[] {
    const prefix = path.endsWith('/') ? path : `${path}/`;
    const names = new Set<string>();
    for (const f of this.files.keys()) if (f.startsWith(prefix)) names.add(f.slice(prefix.length).split('/')[0]);
    return [...names];
  }
}

export { dirname, join };
