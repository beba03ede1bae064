// Which encoding a file's bytes are in, and text to bytes and back in it. Scripts, configs,
// lexicons and rate records are UTF-8, or UTF-16 when they start with its byte-order mark (what
// Windows Notepad saves as "Unicode" and spreadsheets export as "Unicode text"). Without the mark,
// UTF-16 is not guessed: its text holds NUL characters, which no script, config or record has, so
// a NUL is reported where it stands instead of being analysed as words.
// Pure: no fs. A byte-order mark (U+FEFF, UTF-8's included) is not part of the text: editors do
// not show it, so columns on the first line are counted without it (withoutBom), and fixes write
// it back (FixSource.bom).
import { decodeLossless, encodeLossless } from './losslessText';

export type TextEncodingName = 'utf-8' | 'utf-16le' | 'utf-16be';

/** UTF-16 by its byte-order mark (FF FE little-endian, FE FF big-endian); UTF-8 otherwise. */
export function encodingOf(bytes: Uint8Array): TextEncodingName {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return 'utf-16le';
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return 'utf-16be';
  return 'utf-8';
}

/**
 * Bytes that cannot be read as text. As with a system error, `code` is what "cannot read the file
 * (...)" messages print: here the reason in words.
 */
export class UnreadableText extends Error {
  readonly code: string;
  constructor(reason: string) {
    super(reason);
    this.code = reason;
  }
}

/**
 * UTF-16 code units as they are, lone surrogates included, so encodeText gives the same bytes
 * back. An odd byte count cannot be UTF-16 and is refused.
 */
function decodeUtf16(bytes: Uint8Array, littleEndian: boolean): string {
  if (bytes.length % 2) throw new UnreadableText('it starts with a UTF-16 byte-order mark but has an odd number of bytes');
  const parts: string[] = [];
  const units: number[] = [];
  for (let i = 0; i < bytes.length; i += 2) {
    units.push(littleEndian ? bytes[i] | (bytes[i + 1] << 8) : (bytes[i] << 8) | bytes[i + 1]);
    if (units.length === 4096) parts.push(String.fromCharCode(...units.splice(0)));
  }
  parts.push(String.fromCharCode(...units));
  return parts.join('');
}

/**
 * The text of a file's bytes. UTF-8 is read as `lossless` asks: each byte that is not UTF-8 kept
 * as an escape (losslessText.ts, for writing fixes back) or read as U+FFFD (for reading only).
 */
export function decodeText(bytes: Uint8Array, encoding: TextEncodingName, lossless: boolean): string {
  if (encoding === 'utf-8') return lossless ? decodeLossless(bytes) : new TextDecoder('utf-8', { ignoreBOM: true }).decode(bytes);
  return decodeUtf16(bytes, encoding === 'utf-16le');
}

/** The inverse of decodeText (lossless) in the same encoding. */
export function encodeText(text: string, encoding: TextEncodingName): Uint8Array {
  if (encoding === 'utf-8') return encodeLossless(text);
  const out = new Uint8Array(2 * text.length);
  const le = encoding === 'utf-16le';
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    out[2 * i + (le ? 0 : 1)] = c & 0xff;
    out[2 * i + (le ? 1 : 0)] = c >> 8;
  }
  return out;
}

/** The text without a leading byte-order mark. */
export const withoutBom = (text: string): string => (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);

/**
 * 1-based line and column (UTF-16 units) of offset `at` in `text`, for messages; lines end at
 * "\r\n", "\r" or "\n", as scripts are split (parse.ts splitLines).
 */
export function lineAndColumn(text: string, at: number): { line: number; column: number } {
  let line = 1;
  let start = 0;
  const breaks = /\r\n|\r|\n/g;
  for (let m = breaks.exec(text); m !== null && m.index < at; m = breaks.exec(text)) {
    line++;
    start = m.index + m[0].length;
  }
  return { line, column: at - start + 1 };
}

/**
 * Refuses text with a NUL character: UTF-16 saved without its byte-order mark, or a file that is
 * not text at all. Throws UnreadableText naming where the first one is.
 */
export function refuseNul(text: string): void {
  const at = text.indexOf('\0');
  if (at === -1) return;
  const { line, column } = lineAndColumn(text, at);
  throw new UnreadableText(
    `it holds a NUL byte (line ${line}, column ${column}): is it UTF-16 without a byte-order mark? ` +
      'Rungs reads UTF-8, or UTF-16 that starts with its byte-order mark; save the file as UTF-8',
  );
}

/**
 * Where the first byte that is not UTF-8 stands in text decoded losslessly (an escape U+DC80..
 * U+DCFF; decodeLossless), or null when every byte was UTF-8.
 */
export function firstInvalidByte(lossless: string): { line: number; column: number; byte: number } | null {
  const m = /(?<![\ud800-\udbff])[\udc80-\udcff]/.exec(lossless);
  if (!m) return null;
  return { ...lineAndColumn(lossless, m.index), byte: m[0].charCodeAt(0) - 0xdc00 };
}
