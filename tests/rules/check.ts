// The one fixture helper: a fixture is a script whose `// expect: rule-a, rule-b` comments name
// the rules expected on the next line that is neither blank nor another `// expect:` comment (so a
// directive comment can be the target). check() lints the text and
// returns expected and actual `line rule` lists (1-based lines), to compare whole.
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

export function expectations(text: string): string[] {
  const lines = splitLines(text);
  const out: string[] = [];
  lines.forEach((raw, i) => {
    const m = /^\s*\/\/\s*expect:\s*(.+)$/.exec(raw);
    if (!m) return;
    let target = i + 1;
    while (target < lines.length && (!lines[target].trim() || /^\s*\/\/\s*expect:/.test(lines[target]))) target++;
    for (const id of m[1].split(/[,\s]+/).filter(Boolean)) out.push(`${target + 1} ${id}`);
  });
  return out.sort();
}

export function lintText(text: string, settings?: LintSettings): Problem[] {
  return lint(analyzeText(text), text, settings);
}

export function check(text: string, settings?: LintSettings): { expected: string[]; actual: string[]; problems: Problem[] } {
  const problems = lintText(text, settings);
  return { expected: expectations(text), actual: problems.map((p) => `${p.line + 1} ${p.rule}`).sort(), problems };
}
