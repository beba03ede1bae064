// Reading a script for `--fix` and writing its fixed text back. The file is read as bytes and
// decoded losslessly (UTF-8, or UTF-16 after its byte-order mark, written back in the same), so
// every byte outside the fixed spans (invalid UTF-8 included) is written back as it was; just before writing, the file is read again and left alone if it changed during
// the run; the write replaces the file atomically. A failure is a message for the report, never a
// throw, so the remaining files are still fixed and reported.
import { decodeText, encodeText, encodingOf, refuseNul, withoutBom, type TextEncodingName } from '../core/textEncoding';
import type { CliFs } from './io';

export interface FixSource {
  text: string;
  /** The bytes read, when the file system gives bytes (the real one does). */
  bytes: Uint8Array | null;
  /** What the bytes are in (UTF-8, or UTF-16 after its byte-order mark): the fixes are written in it too. */
  encoding: TextEncodingName;
  /** The bytes start with a byte-order mark, which `text` leaves out and the fixes write back. */
  bom: boolean;
}

export function readForFix(fs: CliFs, file: string): FixSource {
  if (fs.readBytes) {
    const bytes = fs.readBytes(file);
    const encoding = encodingOf(bytes);
    const decoded = decodeText(bytes, encoding, true);
    const text = withoutBom(decoded);
    refuseNul(text);
    return { text, bytes, encoding, bom: text !== decoded };
  }
  return { text: fs.readFile(file), bytes: null, encoding: 'utf-8', bom: false };
}

function sameBytes(a: Uint8Array, b: Uint8Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** Writes the fixed text; returns why it was not written, or null. */
export function writeFixed(fs: CliFs, file: string, source: FixSource, fixed: string): string | null {
  try {
    if (source.bytes && fs.readBytes && fs.writeBytes) {
      if (!sameBytes(fs.readBytes(file), source.bytes)) return 'the file changed while it was being checked; fixes not written';
      fs.writeBytes(file, encodeText(source.bom ? `\uFEFF${fixed}` : fixed, source.encoding));
    } else {
      if (fs.readFile(file) !== source.text) return 'the file changed while it was being checked; fixes not written';
      fs.writeFile(file, fixed);
    }
    return null;
  } catch (err) {
    return `cannot write the fixes (${(err as NodeJS.ErrnoException).code ?? String(err)})`;
  }
}
