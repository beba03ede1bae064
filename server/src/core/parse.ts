// The stimulus script format (documented in grammar/README.md). Line-oriented and forgiving:
// every line is a comment, a setting, a rung header or an item, so a file of bare sentences is a
// valid script. Parsing never throws; what it cannot read becomes a problem with a position.
import { finding, type Finding } from './findings';
import { RUNG_KEYS } from './settings';
import type { CommentLine, ItemNode, Override, ParsedScript, RungNode, Setting } from './types';
import { validatePhones } from './phones';
import { pushAll } from './arrays';
import { lookupForm } from './tokenize';

export const COMMENT = '//';
export const RUNG_MARK = '==';
export const NOTE_MARK = '|';

// Keys a rung may carry come from the table of settings (scope rung or both).
export { RUNG_KEYS };

// Applied to a line with its trailing spaces already cut, so no pattern here ends in `\s*$` (a lazy
// group before `\s*$` re-scans a run of spaces from every position: quadratic in its length). The
// `s` flag lets a value hold U+2028 and U+2029, which end no line in the format.
const SETTING_LINE = /^@([A-Za-z][\w-]*)(?:\s*:)?\s*(.*)$/s;
const INLINE_ATTR = /(^|\s)@([A-Za-z][\w-]*)/g;
const ID_TOKEN = /(^|\s)#([\w.:-]+)/g;
// `(?=\S)` keeps `\s+` from giving spaces back and `(?<!\s)` starts the closing `\s*` only at the
// start of a run of spaces, so a long run is scanned a bounded number of times.
export const SET_ATTR = /(^|\s)@set\s+(?=\S)([^@#]+?)(?<!\s)\s*(?=$|\s[@#])/g;

export function splitLines(text: string): string[] {
  return text.split(/\r\n|\r|\n/);
}

/**
 * The line break after each line ("\r\n", "\r", "\n"; "" after the last), so an edit that moves
 * lines can keep every break where it was in a file with mixed line endings.
 */
export function lineBreaks(text: string): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(/\r\n|\r|\n/g)) out.push(m[0]);
  out.push('');
  return out;
}

/** The text's own line ending (its first line break; "\n" when it has none), for edits that add lines. */
export function lineEnding(text: string): string {
  const m = /\r\n|\r|\n/.exec(text);
  return m ? m[0] : '\n';
}

/** A setting as written: its key and value with their columns on the line. */
function setting(key: string, value: string, line: number, keyStart: number, keyEnd: number, valueStart: number): Setting {
  return { key, value, line, keyStart, keyEnd, valueStart, valueEnd: valueStart + value.length };
}

const on = (line: number, character: number, endCharacter: number) => ({ line, character, endLine: line, endCharacter });

/** Splits a comma- or space-separated list of labels. */
export function splitLabels(value: string): string[] {
  return value
    .split(/[,\s]+/)
    .map((s) => s.trim())
    .filter(Boolean);
}

/** Reads `word = PHONES` or `word = N` (N picks the Nth listed pronunciation). */
export function parseOverride(
  body: string,
  line: number,
  bodyStart: number,
  origin: string,
  findings: Finding[],
): Override | null {
  const m = /^(\S+?)\s*(?:=|\s)\s*(.*)$/s.exec(body);
  if (!m || !m[2].trim()) {
    findings.push(finding(on(line, bodyStart, bodyStart + Math.max(1, body.length)), { kind: 'override-without-phones' }));
    return null;
  }
  // Keyed by the form items are looked up by (lower case, ASCII apostrophes, a Latin-script word
  // without its accents), so `@say José = ...` applies to "José" in an item.
  const word = lookupForm(m[1]);
  const rest = m[2].trim();
  const restStart = bodyStart + body.indexOf(rest, m[1].length);
  if (/^\d+$/.test(rest)) {
    return { word, written: m[1], phones: [], variant: Number(rest), origin, line, character: bodyStart };
  }
  const phones = rest.split(/\s+/);
  const bad = validatePhones(phones);
  for (const b of bad) {
    const at = restStart + offsetOfNth(rest, b.index);
    findings.push(finding(on(line, at, at + b.phone.length), { kind: 'phone-not-arpabet', phone: b.phone, reason: b.reason }));
  }
  if (bad.length) return null;
  return { word, written: m[1], phones: phones.map((p) => p.toUpperCase()), variant: null, origin, line, character: bodyStart };
}

function offsetOfNth(text: string, n: number): number {
  const re = /\S+/g;
  let m: RegExpExecArray | null;
  let i = 0;
  while ((m = re.exec(text))) {
    if (i++ === n) return m.index;
  }
  return 0;
}

/** Parses a workspace lexicon file: one `word = PHONES` (or `word PHONES`) per line, `//` comments. */
export function parseLexicon(text: string, origin: string): { overrides: Override[]; findings: Finding[] } {
  const overrides: Override[] = [];
  const findings: Finding[] = [];
  splitLines(text).forEach((raw, line) => {
    const start = raw.length - raw.trimStart().length;
    const body = raw.trim();
    if (!body || body.startsWith(COMMENT)) return;
    const o = parseOverride(body, line, start, origin, findings);
    if (o) overrides.push(o);
  });
  return { overrides, findings };
}

/** Where a header's closing `==` (with the spaces around it) starts, or the length when there is none. */
export function closingMarkStart(body: string): number {
  const space = (i: number) => /\s/.test(body[i]);
  let end = body.length;
  while (end > 0 && space(end - 1)) end--;
  let i = end;
  while (i > 0 && body[i - 1] === '=') i--;
  if (i === end) return body.length;
  while (i > 0 && space(i - 1)) i--;
  return i;
}

function parseRungHeader(raw: string, line: number, start: number): RungNode {
  // "== Name @pace 1.5 @set trained ==": the name runs up to the first inline attribute.
  let bodyStart = start + RUNG_MARK.length;
  while (raw[bodyStart] === '=') bodyStart++;
  let body = raw.slice(bodyStart);
  const tail = closingMarkStart(body);
  body = body.slice(0, tail) + ' '.repeat(body.length - tail);
  const settings: Setting[] = [];
  const attrs = [...body.matchAll(INLINE_ATTR)];
  const nameEnd = attrs.length ? attrs[0].index! + attrs[0][1].length : body.length;
  attrs.forEach((a, i) => {
    const keyStart = bodyStart + a.index! + a[1].length;
    const keyEnd = keyStart + 1 + a[2].length;
    // The last value ends before the closing `==`, which is not part of it.
    const next = i + 1 < attrs.length ? bodyStart + attrs[i + 1].index! : bodyStart + tail;
    const valueRaw = raw.slice(keyEnd, next);
    const lead = valueRaw.length - valueRaw.replace(/^[\s:]+/, '').length;
    const value = valueRaw.trim().replace(/^:\s*/, '');
    settings.push(setting(a[2].toLowerCase(), value, line, keyStart, keyEnd, keyEnd + lead));
  });
  const name = body.slice(0, nameEnd).trim();
  return {
    name: name || `Rung ${line + 1}`,
    line,
    endLine: line,
    implicit: false,
    paces: null,
    sets: [],
    settings,
    items: [],
  };
}

function parseItem(raw: string, line: number, start: number): ItemNode {
  const bar = raw.indexOf(NOTE_MARK, start);
  const spokenRaw = bar < 0 ? raw.slice(start) : raw.slice(start, bar);
  const text = spokenRaw.trimEnd();
  let id: string | null = null;
  let note: string | null = null;
  const sets: string[] = [];
  if (bar >= 0) {
    let trailer = raw.slice(bar + 1);
    trailer = trailer.replace(SET_ATTR, (_m, lead: string, labels: string) => {
      pushAll(sets, splitLabels(labels));
      return lead;
    });
    trailer = trailer.replace(ID_TOKEN, (m, lead: string, value: string) => {
      if (id === null) {
        id = value;
        return lead;
      }
      return m;
    });
    const rest = trailer.replace(/\s+/g, ' ').trim();
    note = rest || null;
  }
  return { line, text, textStart: start, textEnd: start + text.length, id, note, sets };
}

/** Parses a script. Positions in the result are 0-based lines and UTF-16 character offsets. */
export function parseScript(text: string): ParsedScript {
  const lines = splitLines(text);
  const header: Setting[] = [];
  const rungs: RungNode[] = [];
  const comments: CommentLine[] = [];
  const overrides: Override[] = [];
  const findings: Finding[] = [];
  let current: RungNode | null = null;

  const implicitRung = (line: number): RungNode => {
    const r: RungNode = {
      name: 'Items',
      line,
      endLine: line,
      implicit: true,
      paces: null,
      sets: [],
      settings: [],
      items: [],
    };
    rungs.push(r);
    return r;
  };

  lines.forEach((raw, line) => {
    const start = raw.length - raw.trimStart().length;
    if (start === raw.length) return;
    if (raw.startsWith(COMMENT, start)) {
      comments.push({ line, text: raw.slice(start + COMMENT.length).trim(), start });
      if (current) current.endLine = line;
      return;
    }
    if (raw.startsWith(RUNG_MARK, start)) {
      current = parseRungHeader(raw, line, start);
      rungs.push(current);
      return;
    }
    if (raw[start] === '@') {
      const m = SETTING_LINE.exec(raw.slice(start).trimEnd());
      if (!m) {
        findings.push(finding(on(line, start, raw.length), { kind: 'setting-without-key' }));
        return;
      }
      const key = m[1].toLowerCase();
      const keyStart = start;
      const keyEnd = start + 1 + m[1].length;
      const value = m[2];
      const valueStart = value ? raw.indexOf(value, keyEnd) : raw.trimEnd().length;
      const written = setting(key, value, line, keyStart, keyEnd, valueStart);
      if (key === 'say') {
        const o = parseOverride(value, line, valueStart, `line ${line + 1}`, findings);
        if (o) overrides.push(o);
        return;
      }
      // Rung keys after a rung header (or after items in it) belong to that rung.
      if (current && !current.implicit && RUNG_KEYS.has(key)) {
        current.settings.push(written);
        current.endLine = line;
      } else {
        header.push(written);
      }
      return;
    }
    if (!current) current = implicitRung(line);
    const item = parseItem(raw, line, start);
    if (item.text.length === 0) {
      findings.push(finding(on(line, start, raw.length), { kind: 'note-without-sentence' }));
      return;
    }
    current.items.push(item);
    current.endLine = line;
  });

  for (const r of rungs) {
    for (const s of r.settings) if (s.key === 'set' || s.key === 'sets') pushAll(r.sets, splitLabels(s.value));
  }
  return { header, rungs, comments, overrides, findings, lineCount: lines.length };
}
