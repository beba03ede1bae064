// The one fixture helper. A fixture is a script whose marker comments state the problems expected
// on the next line that is neither blank nor another marker (so a directive comment can be the
// target): `//` then a run of `v` over each expected span, then the rule ids, e.g.
//
//   //   vvvvv step-too-big
//   == Long
//
// Columns count from just after the `//` (so a span at column 0 can be marked): the `v`s above
// columns 2-6 of the marker line mark columns 0-4 of the target line. Each span gets each listed id.
// check() lints the text and returns expected and actual `line:start-end rule` lists (1-based
// line, 0-based columns, end exclusive), to compare whole: a test fails when a range is off.
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { splitLines } from '../../server/src/core/parse';
import type { Problem } from '../../server/src/core/types';
import { lint } from '../../server/src/rules/index';
import type { LintSettings } from '../../server/src/rules/types';
import { analyzeText } from '../helpers/data';

export const FIXTURES = join(__dirname, '..', 'fixtures', 'rules');

export function fixtureNames(): string[] {
  return readdirSync(FIXTURES).filter((f) => f.endsWith('.rungs')).sort();
}

export function readFixture(name: string): string {
  return readFileSync(join(FIXTURES, name), 'utf8');
}

/** A marker line: `//`, spans of `v` (columns after the `//`), then rule ids. */
const MARKER = /^\/\/([ v]*v)\s+([a-z][\w-]*(?:\s*,\s*[a-z][\w-]*)*)\s*$/;

export function expectations(text: string): string[] {
  const lines = splitLines(text);
  const out: string[] = [];
  lines.forEach((raw, i) => {
    const m = MARKER.exec(raw);
    if (!m) return;
    let target = i + 1;
    while (target < lines.length && (!lines[target].trim() || MARKER.test(lines[target]))) target++;
    const ids = m[2].split(/\s*,\s*/);
    for (const span of m[1].matchAll(/v+/g)) {
      for (const id of ids) out.push(`${target + 1}:${span.index!}-${span.index! + span[0].length} ${id}`);
    }
  });
  return out.sort();
}

/** A problem as expectations() writes it. */
export const located = (p: Problem): string => `${p.line + 1}:${p.character}-${p.endLine === p.line ? p.endCharacter : `${p.endLine + 1}:${p.endCharacter}`} ${p.rule}`;

export function lintText(text: string, settings?: LintSettings): Problem[] {
  return lint(analyzeText(text), text, settings);
}

export function check(text: string, settings?: LintSettings): { expected: string[]; actual: string[]; problems: Problem[] } {
  const problems = lintText(text, settings);
  return { expected: expectations(text), actual: problems.map(located).sort(), problems };
}

/**
 * A script with three batch fixes (unknown-key, bad-directive, unsorted-rung) beside a duplicate
 * item and an estimated word whose fixes are quick fixes only (batch: false).
 */
export const SEVERAL_FIXES = [
  '// rungs: allow-file thin-rung, step-too-big, uneven-steps',
  '// rungs: allow-file item-outlyer',
  '@title Several fixes',
  '@pacse 1, 1.5 wps',
  '',
  '== Mixed',
  'Would anyone like a cup of coffee?',
  'Tea?',
  'Come in.',
  '',
  '== Later',
  'Come in.',
  'Teodric is here.',
  '',
].join('\n');
