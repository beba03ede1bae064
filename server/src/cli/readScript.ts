// Reading one named script (or standard input) for `rungs lint` and `rungs score`: one place for
// the path shown in messages, the stand-in path standard input resolves config from, and the
// "cannot read" message (file, line 1, column 1, the system's error code).
import { join } from 'node:path';
import type { CliIO } from './io';

export type ReadScript = { text: string; path: string } | { error: string };

export function readScript(io: CliIO, file: string, shown: string, command: string): ReadScript {
  try {
    const text = file === '-' ? (io.readStdin ? io.readStdin() : '') : io.fs.readFile(file);
    // Standard input has no folder: its config files are looked for from the working folder.
    return { text, path: file === '-' ? join(io.cwd, 'stdin.rungs') : file };
  } catch (err) {
    return { error: `rungs ${command}: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})` };
  }
}
