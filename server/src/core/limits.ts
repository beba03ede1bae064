// The size bounds of a script's text (README "Limits"): the analysis reads at most MAX_LINE_CHARS
// characters of a line and MAX_SCRIPT_BYTES bytes (UTF-8) of a script, so a pasted blob or a huge
// document from the editor is checked up to the bound instead of being waited on. Only the text
// analysed is cut; the caller keeps the original, so nothing the user wrote is rewritten.
import { finding, type Finding } from './findings';

/** Longest line analysed, in characters (UTF-16 code units, as editors count columns). */
export const MAX_LINE_CHARS = 10_000;
/** Largest script analysed, in bytes of UTF-8: the same bound the CLI reads files with. */
export const MAX_SCRIPT_BYTES = 32 * 1024 * 1024;

/** A byte count as messages show it ("32 MiB", "100 bytes"). */
export function formatBytes(n: number): string {
  return n % (1024 * 1024) === 0 ? `${n / (1024 * 1024)} MiB` : `${n} bytes`;
}

export interface BoundedText {
  /** The text to analyse: `text` itself when nothing is over a bound. */
  text: string;
  /** One finding per cut line and one for a cut script; empty when nothing was cut. */
  findings: Finding[];
}

/** Where to cut a line so a surrogate pair is not split (the cut may be one code unit short). */
function cutAt(text: string, at: number): number {
  const c = text.charCodeAt(at - 1);
  return c >= 0xd800 && c <= 0xdbff ? at - 1 : at;
}

/**
 * The common case answered quickly (the language server bounds the text on every keystroke): no
 * carriage return, too short to reach the byte bound, and no line longer than the line bound.
 * Every line is short enough exactly when, from the start of each line, a line break stands
 * within the next maxLine + 1 characters (or the text ends first), so the search jumps from a
 * break to the last break of that window instead of visiting every line: a few dozen native
 * searches for a 10,000-line script. Each character is searched at most twice.
 */
export function withinBounds(text: string, maxLine: number, maxBytes: number): boolean {
  if (maxBytes < text.length * 3 || text.includes('\r')) return false;
  const n = text.length;
  let start = 0;
  while (n - start > maxLine) {
    const end = text.lastIndexOf('\n', start + maxLine);
    if (end < start) return false;
    start = end + 1;
  }
  return true;
}

/** UTF-8 length of text[from, to), counting a lone surrogate as 3 bytes (as U+FFFD). */
function utf8Length(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < to && (text.charCodeAt(i + 1) & 0xfc00) === 0xdc00) {
      n += 4;
      i++;
    } else n += 3;
  }
  return n;
}

export function boundText(text: string, maxLine = MAX_LINE_CHARS, maxBytes = MAX_SCRIPT_BYTES): BoundedText {
  if (withinBounds(text, maxLine, maxBytes)) return { text, findings: [] };
  const findings: Finding[] = [];
  // The spans left out (with what stands in their place), in order; the text is rebuilt only when
  // there is one.
  const dropped: [number, number, string][] = [];
  const countBytes = maxBytes < text.length * 3;
  let bytes = 0;
  let line = 0;
  let start = 0;
  // One pass over the lines (breaks \r\n, \r, \n as splitLines); linear in the text's length.
  for (;;) {
    let end = start;
    while (end < text.length && text.charCodeAt(end) !== 10 && text.charCodeAt(end) !== 13) end++;
    const brk = end >= text.length ? 0 : text.charCodeAt(end) === 13 && text.charCodeAt(end + 1) === 10 ? 2 : 1;
    const length = end - start;
    const kept = length > maxLine ? cutAt(text, start + maxLine) - start : length;
    // The whole line (up to its own bound) and its break must fit, or the script stops before it.
    if (countBytes) bytes += utf8Length(text, start, start + kept) + brk;
    if (bytes > maxBytes) {
      findings.push(finding({ line, character: 0, endLine: line, endCharacter: length }, { kind: 'script-over-limit', limit: maxBytes, checkedLines: line }));
      dropped.push([start, text.length, '']);
      break;
    }
    if (kept < length) {
      findings.push(finding({ line, character: kept, endLine: line, endCharacter: length }, { kind: 'line-over-limit', limit: maxLine, length }));
      // A line cut to nothing between a lone CR break and its own LF break would join the two into
      // one CRLF break and lose a line; its LF is then analysed as a CR (the analysed text is
      // never written back, and a line break of either kind ends the line at the same place).
      const joins = kept === 0 && brk === 1 && text.charCodeAt(end) === 10 && start > 0 && text.charCodeAt(start - 1) === 13;
      dropped.push(joins ? [start, end + 1, '\r'] : [start + kept, end, '']);
    }
    if (brk === 0) break;
    start = end + brk;
    line++;
  }
  if (!dropped.length) return { text, findings };
  const parts: string[] = [];
  let at = 0;
  for (const [from, to, instead] of dropped) {
    parts.push(text.slice(at, from), instead);
    at = to;
  }
  parts.push(text.slice(at));
  return { text: parts.join(''), findings };
}
