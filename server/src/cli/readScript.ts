// Reads a script named on the command line. A file over the size bound is not refused outright:
// its first part (whole lines up to the bound) is checked and the cut is reported, so a huge file
// is never waited on and never silently skipped. `--fix` reads whole files only (readForFix).
import { splitLines } from '../core/parse';
import { formatBytes, MAX_FILE_BYTES } from '../node/boundedRead';
import type { CliIO } from './io';

export interface ScriptText {
  text: string;
  /** Set when only the first part of the file was read: what to tell the user. */
  cut: string | null;
}

export function readScript(io: CliIO, file: string): ScriptText {
  if (file === '-') return { text: io.readStdin ? io.readStdin() : '', cut: null };
  try {
    return { text: io.fs.readFile(file), cut: null };
  } catch (err) {
    if (!(err as { tooLarge?: boolean }).tooLarge || !io.fs.readPrefix) throw err;
    const text = io.fs.readPrefix(file);
    return { text, cut: `larger than ${formatBytes(MAX_FILE_BYTES)}: checked up to line ${splitLines(text).length - 1} only` };
  }
}
