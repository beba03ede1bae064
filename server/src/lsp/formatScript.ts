// Document formatting: normalises spacing and never changes what an item says. Per line:
// indentation and trailing spaces go; a setting is "@key value" (one space, no colon; pace lists
// as "1, 1.5 wps"); a rung header is "== Name @attr value" (a trailing "==" kept); an item keeps
// its spoken text byte-identical and gets " | " before a trailer whose spaces are collapsed.
// Runs of blank lines shrink to one, a rung header after an item gets a blank line before it,
// leading blank lines go, and the file ends with exactly one line ending.
import type { TextEdit } from 'vscode-languageserver/node';
import { closingMarkStart, lineEnding, parseScript, splitLines } from '../core/parse';

// No pattern here scans a run of spaces from each of its positions (`\s*,` or `(.*?)\s*$` do, and cost
// time quadratic in the run): values are trimmed and split with string methods instead. The `s`
// flag lets a line hold U+2028 and U+2029, which the format does not treat as line ends.
function formatSetting(t: string): string {
  const m = /^(@[A-Za-z][\w-]*)(?:\s*:)?\s*(.*)$/s.exec(t.trimEnd());
  if (!m) return t;
  let value = m[2];
  const key = m[1].toLowerCase();
  if (key === '@pace' || key === '@paces') value = value.split(',').map((p) => p.trim()).join(', ').replace(/\s+/g, ' ');
  if (key === '@say') {
    const eq = value.indexOf('=');
    if (eq >= 0) value = `${value.slice(0, eq).trimEnd()} = ${value.slice(eq + 1).trimStart()}`;
    value = value.replace(/\s+/g, ' ');
  }
  // A value that itself starts with ":" keeps the key's colon, or the next reading would take it.
  return value ? `${m[1]}${value.startsWith(':') ? ':' : ''} ${value}` : m[1];
}

function formatHeader(t: string): string {
  const m = /^(=+)\s*(.*)$/s.exec(t.trimEnd())!;
  let body = m[2];
  let tail = '';
  const close = closingMarkStart(body);
  if (close < body.length && close > 0) {
    tail = ` ${body.slice(close).trim()}`;
    body = body.slice(0, close);
  }
  // Split before each inline attribute and give every part single spacing. `(?<!\s)` starts a
  // match only at the start of a run of spaces, so each run is scanned once.
  const parts = body.split(/(?<!\s)\s+(?=@[A-Za-z])/).map((p, i) => (i === 0 ? p.trim() : formatSetting(p.trim())));
  const joined = parts.filter(Boolean).join(' ');
  return `${m[1]}${joined ? ` ${joined}` : ''}${tail}`;
}

function formatItem(t: string): string {
  const bar = t.indexOf('|');
  if (bar < 0) return t;
  const spoken = t.slice(0, bar).trimEnd();
  const trailer = t.slice(bar + 1).trim().replace(/\s+/g, ' ');
  return trailer ? `${spoken} | ${trailer}` : `${spoken} |`;
}

export function formatScript(text: string): string {
  const lines = splitLines(text);
  const out: string[] = [];
  let lastKind: 'blank' | 'item' | 'other' = 'blank';
  for (const raw of lines) {
    const t = raw.trim();
    if (!t) {
      if (out.length && out[out.length - 1] !== '') out.push('');
      lastKind = 'blank';
      continue;
    }
    if (t.startsWith('//')) {
      out.push(t);
      lastKind = 'other';
    } else if (t.startsWith('==')) {
      if (lastKind === 'item') out.push('');
      out.push(formatHeader(t));
      lastKind = 'other';
    } else if (t.startsWith('@')) {
      out.push(formatSetting(t));
      lastKind = 'other';
    } else {
      out.push(formatItem(raw.trimStart().trimEnd()));
      lastKind = 'item';
    }
  }
  while (out.length && out[out.length - 1] === '') out.pop();
  const eol = lineEnding(text);
  return out.length ? out.join(eol) + eol : '';
}

/** Item texts in order: formatting must leave this list unchanged. */
export function itemTexts(text: string): string[] {
  return parseScript(text).rungs.flatMap((r) => r.items.map((i) => i.text));
}

export function formatDocument(text: string): TextEdit[] {
  const formatted = formatScript(text);
  if (formatted === text) return [];
  // Safety net: if the spoken text of any item would change, do not format at all.
  const a = itemTexts(text);
  const b = itemTexts(formatted);
  if (a.length !== b.length || a.some((x, i) => x !== b[i])) return [];
  const lines = splitLines(text);
  const last = lines.length - 1;
  return [{ range: { start: { line: 0, character: 0 }, end: { line: last, character: lines[last].length } }, newText: formatted }];
}
