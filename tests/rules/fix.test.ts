// Fixes are data: apply each one alone, re-lint, and check the problem is gone while every line
// outside the fix's edits is byte-identical (and a sorted rung holds the very same lines).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { splitLines } from '../../server/src/core/parse';
import type { Problem } from '../../server/src/core/types';
import { applyFixes } from '../../server/src/rules/fixes';
import { fixtureNames, lintText, readFixture } from './check';

const demo = readFileSync(join(__dirname, '..', '..', 'sample-scripts', 'family-visits-draft.rungs'), 'utf8');
const sources: [string, string][] = [['family-visits-draft.rungs', demo], ...fixtureNames().map((n): [string, string] => [n, readFixture(n)])];

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
