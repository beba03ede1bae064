// Reading one named script (or standard input) for `rungs lint` and `rungs score`: one place for
// the path shown in messages, the stand-in path standard input resolves config from, and the
// "cannot read" message (file, line 1, column 1, the system's error code). A file over the size
// bound is not refused outright: its first part (whole lines up to the bound) is checked and the
// cut is reported, so a huge file is never waited on and never silently skipped. `--fix` reads
// whole files only, as bytes kept losslessly (readForFix). A byte that is not UTF-8 is read as
// U+FFFD and checked on: where the first one stands is told, so a misread word can be found.
import { join } from 'node:path';
import { decodeLossless } from '../core/losslessText';
import { splitLines } from '../core/parse';
import { encodingOf, firstInvalidByte, withoutBom } from '../core/textEncoding';
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
      /** Where the first byte that is not UTF-8 stands, as a message after "FILE:LINE:COLUMN: ", or null. */
      notUtf8?: { line: number; column: number; message: string } | null;
    }
  | { error: string };

export function readScript(io: CliIO, file: string, shown: string, command: string, forFix = false): ReadScript {
  // Standard input has no folder: its config files are looked for from the working folder.
  const path = file === '-' ? join(io.cwd, 'stdin.rungs') : file;
  try {
    if (file === '-') return { text: io.readStdin ? io.readStdin() : '', path, cut: null };
    if (forFix) {
      const source = readForFix(io.fs, file);
      return { text: source.text, path, cut: null, source, notUtf8: source.encoding === 'utf-8' ? notUtf8(source.text) : null };
    }
    try {
      const text = io.fs.readFile(file);
      // Only a text with U+FFFD in it can have had a byte that is not UTF-8: then the bytes tell.
      if (!text.includes('\uFFFD') || !io.fs.readBytes) return { text, path, cut: null };
      const bytes = io.fs.readBytes(file);
      return { text, path, cut: null, notUtf8: encodingOf(bytes) === 'utf-8' ? notUtf8(withoutBom(decodeLossless(bytes))) : null };
    } catch (err) {
      if (!(err as { tooLarge?: boolean }).tooLarge || !io.fs.readPrefix) throw err;
      const text = io.fs.readPrefix(file);
      return { text, path, cut: `larger than ${formatBytes(MAX_FILE_BYTES)}: checked up to line ${splitLines(text).length - 1} only` };
    }
  } catch (err) {
    return { error: `rungs ${command}: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})` };
  }
}

function notUtf8(lossless: string): { line: number; column: number; message: string } | null {
  const at = firstInvalidByte(lossless);
  if (!at) return null;
  const hex = at.byte.toString(16).toUpperCase().padStart(2, '0');
  return { ...at, message: `byte 0x${hex} is not UTF-8 (read as U+FFFD, so a word there may be misread); save the file as UTF-8` };
}
