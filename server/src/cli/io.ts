// What the CLI may touch, passed in so tests can run commands in-process on a fake file system.
export interface CliFs {
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

export interface CliIO {
  argv: string[];
  cwd: string;
  fs: CliFs;
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Reads all of standard input (for `-`). */
  readStdin?: () => string;
  /** True when stdout is a terminal (colour, progress). */
  isTTY?: boolean;
  env?: Record<string, string | undefined>;
}

export const EXIT_OK = 0;
export const EXIT_PROBLEMS = 1;
export const EXIT_USAGE = 2;

export class UsageError extends Error {}
