// Reads files the way a linter fed untrusted paths must: regular files only (a named pipe or a
// device such as /dev/zero would block or never end) and never more than a fixed number of bytes.
// Shared by the CLI and the language server.
import { formatBytes, MAX_SCRIPT_BYTES } from '../core/limits';
import { closeSync, constants, fstatSync, openSync, readSync, realpathSync, statSync } from 'node:fs';
import { decodeText, encodingOf, refuseNul, withoutBom } from '../core/textEncoding';

/** Largest script, config or lexicon file read, in bytes (README "Limits"): the analysis's bound. */
export const MAX_FILE_BYTES = MAX_SCRIPT_BYTES;
export { formatBytes };

/**
 * A read refused on purpose. Callers print `(err.code)` after "cannot read ..."; here `code` is the
 * reason in words ("not a regular file", "larger than 32 MiB") so those messages read plainly.
 */
export class ReadRefused extends Error {
  readonly code: string;
  constructor(
    reason: string,
    /** True when the file was refused for its size only (its first bytes can still be read). */
    readonly tooLarge = false,
  ) {
    super(reason);
    this.code = reason;
  }
}

/** The bytes of a regular file, refusing other kinds of file and anything over `limit` bytes. */
export function readBytesBounded(path: string, limit = MAX_FILE_BYTES): Buffer {
  // O_NONBLOCK lets a named pipe open at once (without it the open waits for a writer); fstat on
  // the open descriptor then checks the very file that will be read.
  const fd = openSync(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  try {
    const stat = fstatSync(fd);
    if (!stat.isFile()) throw new ReadRefused('not a regular file');
    // Sizes can lie (files in /proc report 0), so read until the end or one byte past the bound.
    // The stated size sizes the buffer (one byte more, to see the end in the same buffer), so a
    // library of small scripts is read without a large buffer per file; a file longer than it
    // said grows the buffer.
    let buf = Buffer.allocUnsafe(Math.min(limit + 1, stat.size > 0 ? stat.size + 1 : 1 << 12));
    let total = 0;
    for (;;) {
      if (total === buf.length) {
        const bigger = Buffer.allocUnsafe(Math.min(limit + 1, 2 * buf.length));
        buf.copy(bigger, 0, 0, total);
        buf = bigger;
      }
      const n = readSync(fd, buf, total, buf.length - total, null);
      if (n === 0) break;
      total += n;
      if (total > limit) throw new ReadRefused(`larger than ${formatBytes(limit)}`, true);
    }
    return buf.subarray(0, total);
  } finally {
    closeSync(fd);
  }
}

/**
 * Text from a file's bytes: UTF-8 (a byte that is not UTF-8 read as U+FFFD), or UTF-16 after its
 * byte-order mark; without the mark. Text with a NUL in it is refused with where it stands
 * (core/textEncoding.ts).
 */
export function textOfBytes(bytes: Buffer): string {
  const encoding = encodingOf(bytes);
  const text = withoutBom(encoding === 'utf-8' ? bytes.toString('utf8') : decodeText(bytes, encoding, false));
  refuseNul(text);
  return text;
}

/** A regular file's text (textOfBytes), bounded as readBytesBounded. */
export function readTextBounded(path: string, limit = MAX_FILE_BYTES): string {
  return textOfBytes(readBytesBounded(path, limit));
}

/** True for a regular file (following links); false for folders, pipes, devices and missing paths. */
export function isRegularFile(path: string): boolean {
  try {
    return statSync(path).isFile();
  } catch {
    return false;
  }
}

/** The real path (links resolved), or the path itself when it cannot be resolved. */
export function realPath(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return path;
  }
}


/** All of standard input as text, up to `limit` bytes (a pipe from /dev/zero must not hang us). */
export function readStdinBounded(limit = MAX_FILE_BYTES): string {
  const chunks: Buffer[] = [];
  let total = 0;
  for (;;) {
    const buf = Buffer.allocUnsafe(1 << 16);
    let n: number;
    try {
      n = readSync(0, buf, 0, buf.length, null);
    } catch (err) {
      // A non-blocking stdin with nothing ready yet: try again; end of input otherwise.
      if ((err as NodeJS.ErrnoException).code === 'EAGAIN') continue;
      if ((err as NodeJS.ErrnoException).code === 'EOF') break;
      throw err;
    }
    if (n === 0) break;
    chunks.push(buf.subarray(0, n));
    total += n;
    if (total > limit) throw new ReadRefused(`larger than ${formatBytes(limit)}`);
  }
  return textOfBytes(Buffer.concat(chunks, total));
}

/**
 * The first `limit` bytes of a regular file as text, cut after the last whole line, so a script
 * over the bound can still be checked up to it.
 */
export function readTextPrefix(path: string, limit = MAX_FILE_BYTES): string {
  const fd = openSync(path, constants.O_RDONLY | (constants.O_NONBLOCK ?? 0));
  try {
    if (!fstatSync(fd).isFile()) throw new ReadRefused('not a regular file');
    const buf = Buffer.alloc(limit);
    let n = 0;
    while (n < limit) {
      const got = readSync(fd, buf, n, limit - n, null);
      if (got === 0) break;
      n += got;
    }
    const encoding = encodingOf(buf.subarray(0, n));
    let text: string;
    if (encoding === 'utf-8') {
      const lastBreak = Math.max(buf.lastIndexOf(0x0a, n - 1), buf.lastIndexOf(0x0d, n - 1));
      text = buf.subarray(0, lastBreak + 1).toString('utf8');
    } else {
      // UTF-16: whole code units, then whole lines of the text.
      const units = decodeText(buf.subarray(0, n - (n % 2)), encoding, false);
      text = units.slice(0, Math.max(units.lastIndexOf('\n'), units.lastIndexOf('\r')) + 1);
    }
    text = withoutBom(text);
    refuseNul(text);
    return text;
  } finally {
    closeSync(fd);
  }
}
