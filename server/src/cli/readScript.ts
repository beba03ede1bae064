// Reading one named script (or standard input) for `rungs lint` and `rungs score`: one place for
// the path shown in messages, the stand-in path standard input resolves config from, and the
// "cannot read" message (file, line 1, column 1, the system's error code). A file over the size
// bound is not refused outright: its first part (whole lines up to the bound) is checked and the
// cut is reported, so a huge file is never waited on and never silently skipped. `--fix` reads
// whole files only, as bytes kept losslessly (readForFix).
import { join } from 'node:path';
import { splitLines } from '../core/parse';
import { formatBytes, MAX_FILE_BYTES } from '../node/boundedRead';
import type { CliIO } from './io';
import { readForFix, type FixSource } from './writeFixes';

export type ReadScript =
  | {
      text: string;
      path: string;
      /** Set when only the first part of the file was read: what to tell the user. */
      cut: string | null;
      /** The bytes read for `--fix` (absent unless asked for). */
      source?: FixSource;
    }
  | { error: string };

export function readScript(io: CliIO, file: string, shown: string, command: string, forFix = false): ReadScript {
  // Standard input has no folder: its config files are looked for from the working folder.
  const path = file === '-' ? join(io.cwd, 'stdin.rungs') : file;
  try {
    if (file === '-') return { text: io.readStdin ? io.readStdin() : '', path, cut: null };
    if (forFix) {
      const source = readForFix(io.fs, file);
      return { text: source.text, path, cut: null, source };
    }
    try {
      return { text: io.fs.readFile(file), path, cut: null };
    } catch (err) {
      if (!(err as { tooLarge?: boolean }).tooLarge || !io.fs.readPrefix) throw err;
      const text = io.fs.readPrefix(file);
      return { text, path, cut: `larger than ${formatBytes(MAX_FILE_BYTES)}: checked up to line ${splitLines(text).length - 1} only` };
    }
  } catch (err) {
    return { error: `rungs ${command}: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})` };
  }
}
