// What the CLI may touch, passed in so tests can run commands in-process on a fake file system.
import type { NodeFs } from '../node/nodeFs';

/** The file system the CLI may touch (node/nodeFs.ts is the real one). */
export type CliFs = NodeFs;

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
