// Fixes are data: apply each one alone, re-lint, and check the problem is gone while every line
// outside the fix's edits is byte-identical, and on the edited lines every character outside the
// edit ranges is unchanged (a sorted rung holds the very same lines). Several fixes applied at once
// leave every other line byte-identical too. Fixes marked `batch: false` are never gathered for
// `--fix` or fix-all.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { splitLines } from '../../server/src/core/parse';
import type { Problem, TextEdit } from '../../server/src/core/types';
import { applyFixes, batchFixes } from '../../server/src/rules/fixes';
import { fixtureNames, lintText, readFixture, SEVERAL_FIXES } from './check';

const demo = readFileSync(join(__dirname, '..', '..', 'sample-scripts', 'family-visits-draft.rungs'), 'utf8');
const sources: [string, string][] = [['family-visits-draft.rungs', demo], ...fixtureNames().map((n): [string, string] => [n, readFixture(n)])];

/** Offset of a 0-based line and character, counting the text's own line breaks. */
function offsetOf(text: string, line: number, character: number): number {
  const breaks = [...text.matchAll(/\r\n|\r|\n/g)];
  const start = line === 0 ? 0 : breaks[line - 1].index! + breaks[line - 1][0].length;
  return start + character;
}

/** The text between and around the edits, in order: what a fix must copy unchanged. */
function keptSegments(text: string, edits: TextEdit[]): string[] {
  const spans = edits
    .map((e) => [offsetOf(text, e.line, e.character), offsetOf(text, e.endLine, e.endCharacter)] as const)
    .sort((a, b) => a[0] - b[0]);
  const out: string[] = [];
  let at = 0;
  for (const [start, end] of spans) {
    out.push(text.slice(at, start));
    at = end;
  }
  out.push(text.slice(at));
  return out;
}

function checkFix(text: string, p: Problem): void {
  const before = splitLines(text);
  const fixed = applyFixes(text, [p.fix!]);
  expect(fixed.applied).toBe(1);
  const after = splitLines(fixed.text);
  const first = Math.min(...p.fix!.edits.map((e) => e.line));
  const last = Math.max(...p.fix!.edits.map((e) => e.endLine));
  const tail = before.length - 1 - last;
  // Lines above and below the edited lines are untouched, byte for byte.
  expect(after.slice(0, first)).toEqual(before.slice(0, first));
  expect(after.slice(after.length - tail)).toEqual(before.slice(before.length - tail));
  // On the edited lines, the characters before the first edit and after the last are unchanged.
  const lead = p.fix!.edits.reduce((a, e) => (e.line < a.line || (e.line === a.line && e.character < a.character) ? e : a));
  const end = p.fix!.edits.reduce((a, e) => (e.endLine > a.endLine || (e.endLine === a.endLine && e.endCharacter > a.endCharacter) ? e : a));
  expect(fixed.text.startsWith(text.slice(0, offsetOf(text, lead.line, lead.character)))).toBe(true);
  expect(fixed.text.endsWith(text.slice(offsetOf(text, end.endLine, end.endCharacter)))).toBe(true);
  expect(after[first].slice(0, lead.line === first ? lead.character : 0)).toBe(before[first].slice(0, lead.line === first ? lead.character : 0));
  const keepEnd = before[last].length - end.endCharacter;
  expect(after[after.length - 1 - tail].slice(after[after.length - 1 - tail].length - keepEnd)).toBe(before[last].slice(end.endCharacter));
  // Every stretch between two edits is copied whole and in order: the result is exactly the kept
  // segments with the new texts between them.
  const kept = keptSegments(text, p.fix!.edits);
  const inserted = [...p.fix!.edits].sort((a, b) => offsetOf(text, a.line, a.character) - offsetOf(text, b.line, b.character)).map((e) => e.newText);
  expect(fixed.text).toBe(kept.map((k, i) => k + (inserted[i] ?? '')).join(''));
  const oldMiddle = before.slice(first, last + 1);
  const newMiddle = after.slice(first, after.length - tail);
  if (p.rule === 'unsorted-rung') expect([...newMiddle].sort()).toEqual([...oldMiddle].sort());
  else expect(Math.abs(newMiddle.length - oldMiddle.length)).toBeLessThanOrEqual(1);
  // The problem is gone after re-linting.
  const again = lintText(fixed.text);
  const count = (ps: Problem[]) => ps.filter((q) => q.rule === p.rule).length;
  expect(count(again)).toBeLessThan(count(lintText(text)));
  if (p.rule === 'estimated-word') expect(again.some((q) => q.message === p.message)).toBe(false);
  if (p.rule === 'unsorted-rung') expect(again.some((q) => q.rule === p.rule && q.line === p.line)).toBe(false);
}

describe('every fix', () => {
  let total = 0;
  for (const [name, text] of sources) {
    for (const p of lintText(text).filter((q) => q.fix)) {
      total++;
      it(`${name}:${p.line + 1} ${p.rule}`, () => checkFix(text, p));
    }
  }
  it('covers every kind of fix', () => {
    const rules = new Set(sources.flatMap(([, t]) => lintText(t).filter((q) => q.fix).map((q) => q.rule)));
    expect([...rules].sort()).toEqual(['bad-directive', 'duplicate-item', 'estimated-word', 'unknown-key', 'unsorted-rung']);
    expect(total).toBeGreaterThan(8);
  });
});

describe('several fixes at once, as --fix gathers them', () => {
  // unknown-key, bad-directive and unsorted-rung fixes in one file, next to a duplicate item and an
  // estimated word whose fixes are quick fixes only (batch: false).
  const TEXT = SEVERAL_FIXES;
  const problems = lintText(TEXT);
  const fixes = batchFixes(problems);

  it('gathers only the batch fixes', () => {
    expect(problems.filter((p) => p.fix).map((p) => `${p.line + 1} ${p.rule}`)).toEqual([
      '2 bad-directive',
      '4 unknown-key',
      '6 unsorted-rung',
      '12 duplicate-item',
      '13 estimated-word',
    ]);
    expect(fixes.map((f) => f.title)).toEqual(problems.filter((p) => p.rule === 'unknown-key' || p.rule === 'unsorted-rung' || p.rule === 'bad-directive').map((p) => p.fix!.title));
  });

  it('applies them all, and re-linting shows those problems gone and every other line byte-identical', () => {
    const out = applyFixes(TEXT, fixes);
    expect(out).toMatchObject({ applied: 3, skipped: 0 });
    const before = splitLines(TEXT);
    const after = splitLines(out.text);
    expect(after.length).toBe(before.length);
    const edited = new Set(fixes.flatMap((f) => f.edits.flatMap((e) => Array.from({ length: e.endLine - e.line + 1 }, (_, i) => e.line + i))));
    before.forEach((line, i) => {
      if (!edited.has(i)) expect(after[i], `line ${i + 1}`).toBe(line);
    });
    expect(after[1]).toBe('// rungs: allow-file item-outlier');
    expect(after[3]).toBe('@paces 1, 1.5 wps');
    // The sorted rung holds the same item lines in a new order (re-linting below shows it sorted).
    expect([...after.slice(6, 9)].sort()).toEqual([...before.slice(6, 9)].sort());
    expect(after.slice(6, 9)).not.toEqual(before.slice(6, 9));
    const again = lintText(out.text);
    expect(again.filter((p) => ['unknown-key', 'bad-directive', 'unsorted-rung'].includes(p.rule))).toEqual([]);
    expect(batchFixes(again)).toEqual([]);
    // The quick-fix-only problems are still there, fixes and all.
    expect(again.filter((p) => p.fix).map((p) => `${p.line + 1} ${p.rule} ${p.fix!.batch}`)).toEqual(['12 duplicate-item false', '13 estimated-word false']);
  });
});

describe('sorting a rung', () => {
  it('moves each item with the comments directly above it and keeps other lines in place', () => {
    const text = readFixture('unsorted-rung.rungs');
    const p = lintText(text).find((q) => q.rule === 'unsorted-rung')!;
    const out = applyFixes(text, [p.fix!]).text;
    const rung = out.slice(out.indexOf('== Mixed'), out.indexOf('== Sorted'));
    expect(rung).toBe(
      ['== Mixed', 'Tea?', 'Come in.', '', 'No thanks.', '@pace 1.5 wps', '// a comment that belongs to the item below', 'Yes, please.', '', ''].join('\n'),
    );
  });

  it('keeps CRLF line endings', () => {
    const text = readFixture('unsorted-rung.rungs').replace(/\n/g, '\r\n');
    const p = lintText(text).find((q) => q.rule === 'unsorted-rung')!;
    const out = applyFixes(text, [p.fix!]).text;
    expect(out.split('\r\n').length).toBe(text.split('\r\n').length);
    expect(out.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  });
});

describe('applyFixes', () => {
  const edit = (line: number, character: number, endCharacter: number, newText: string) => ({ line, character, endLine: line, endCharacter, newText });
  it('applies identical edits once and skips a fix that overlaps one already taken', () => {
    const r = applyFixes('abc\ndef\n', [
      { title: 'x', edits: [edit(0, 0, 1, 'X')] },
      { title: 'x again', edits: [edit(0, 0, 1, 'X')] },
      { title: 'clash', edits: [edit(0, 0, 2, 'YY')] },
      { title: 'ok', edits: [edit(1, 3, 3, '!')] },
    ]);
    expect(r).toEqual({ text: 'Xbc\ndef!\n', applied: 3, skipped: 1 });
  });
  it('inserts two different texts at one point only once (the second is skipped)', () => {
    const r = applyFixes('a\n', [
      { title: '1', edits: [edit(1, 0, 0, 'one\n')] },
      { title: '2', edits: [edit(1, 0, 0, 'two\n')] },
    ]);
    expect(r).toEqual({ text: 'a\none\n', applied: 1, skipped: 1 });
  });
});
