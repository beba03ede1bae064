// The node-side file system and paths, shared by the CLI and the language server: the only module
// besides the CLI edge that touches node:fs. Everything above it takes the small `CliFs`/`ConfigFs`
// views, so tests run on an in-memory file system.
import * as fs from 'node:fs';
import { normalize } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeFileAtomic } from './atomicWrite';
import { isRegularFile, readBytesBounded, readStdinBounded, readTextBounded, readTextPrefix, realPath } from './boundedRead';

/** What the CLI and the checking pipeline may do with files (a superset of the resolver's ConfigFs). */
export interface NodeFs {
  readFile(path: string): string;
  writeFile(path: string, text: string): void;
  isDirectory(path: string): boolean;
  exists(path: string): boolean;
  readdir(path: string): string[];
  /** False for pipes, devices and sockets, which the folder walk skips (absent: every file is regular). */
  isFile?(path: string): boolean;
  /** The path with links resolved, so a walk visits each folder and file once (absent: the path). */
  realpath?(path: string): string;
  /** The file's bytes, so `--fix` can keep every byte it does not fix (absent: readFile's text). */
  readBytes?(path: string): Uint8Array;
  /** Whole lines from the start of a file over the size bound, up to the bound (absent: refused). */
  readPrefix?(path: string): string;
  /** Replaces the file's content atomically, keeping its mode (absent: writeFile). */
  writeBytes?(path: string, bytes: Uint8Array): void;
}

export const nodeFs: NodeFs = {
  readFile: (p) => readTextBounded(p),
  writeFile: (p, text) => fs.writeFileSync(p, text),
  isDirectory: (p) => {
    try {
      return fs.statSync(p).isDirectory();
    } catch {
      return false;
    }
  },
  exists: (p) => fs.existsSync(p),
  readdir: (p) => fs.readdirSync(p),
  isFile: isRegularFile,
  realpath: realPath,
  readBytes: (p) => readBytesBounded(p),
  readPrefix: (p) => readTextPrefix(p),
  writeBytes: writeFileAtomic,
};

/** Reads all of standard input, up to the size bound. */
export const readStdin = (): string => readStdinBounded();

/** A path as a comparison key: normalised, and case-folded where the file system ignores case. */
export function pathKey(path: string): string {
  const n = normalize(path);
  return process.platform === 'win32' || process.platform === 'darwin' ? n.toLowerCase() : n;
}

/** The file path of a `file:` URI, or null for any other scheme (an unsaved editor buffer). */
export function uriToPath(uri: string): string | null {
  if (!uri.startsWith('file:')) return null;
  try {
    return fileURLToPath(uri);
  } catch {
    return null;
  }
}

/** Flags with which an LSP client names the transport (`--stdio`, `--node-ipc`, ...). */
const TRANSPORT_FLAGS = ['--stdio', '--node-ipc', '--socket', '--pipe', '--clientProcessId'];

/** True when the process arguments name a transport for the language server to pick up itself. */
export function transportNamed(argv: readonly string[]): boolean {
  return argv.some((a) => TRANSPORT_FLAGS.some((f) => a === f || a.startsWith(`${f}=`)));
}
