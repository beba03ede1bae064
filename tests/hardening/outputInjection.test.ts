// Item 7 of the hardening issue: CSV cells a spreadsheet would run as formulas are neutralised,
// and terminal control sequences in what a script says are shown escaped, never sent raw.
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { formatCsv, formatTable } from '../../server/src/cli/formatScore';
import { unifiedDiff } from '../../server/src/cli/formats/diff';
import { formatLintText as formatText } from '../../server/src/cli/formats/text';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { lint } from '../../server/src/rules/index';
import { analyzeText } from '../helpers/data';
import { MemFs } from '../cli/memfs';

const ESC = '\u001b';
// An OSC title-setting sequence and a colour sequence (ECMA-48 / xterm control sequences).
const TITLE = `${ESC}]0;owned${String.fromCharCode(7)}`;
const RED = `${ESC}[31m`;

describe('CSV', () => {
  it('prefixes formula-looking text cells with an apostrophe and keeps numbers', () => {
    const text = `== =HYPERLINK("x")\n=1+1 see you.\n+call me.\n-dash here.\n@home now | note\nPlain item.\n`;
    const a = analyzeText(text);
    const rows = parse(formatCsv([{ file: '@evil.rungs', analysis: a, problems: [] }]), { columns: true }) as Record<string, string>[];
    // OWASP "CSV Injection": cells beginning with = + - @ (and tab, CR) are prefixed with '.
    expect(rows.map((r) => r.text)).toEqual(["'=1+1 see you.", "'+call me.", "'-dash here.", 'Plain item.']);
    expect(rows[0].rung).toBe(`'=HYPERLINK("x")`);
    expect(rows[0].file).toBe("'@evil.rungs");
    expect(rows.every((r) => /^\d+$/.test(r.line) && /^\d+(\.\d+)?$/.test(r.difficulty))).toBe(true);
  });
});

describe('terminal output', () => {
  const text = `@title Week${TITLE}\n== Rung${RED} one\nHi${TITLE} there.\nHi${TITLE} there.\nSee you.\n`;
  const a = analyzeText(text);
  const problems = lint(a, text, { severities: {} });

  it('the score table escapes titles, rung names and items', () => {
    const out = formatTable([{ file: 'a.rungs', analysis: a, problems }], 'caution');
    expect(out).not.toContain(ESC);
    expect(out).toContain('Week\\x1b]0;owned\\x07');
    expect(out).toContain('Rung\\x1b[31m one');
  });

  it('lint text output escapes messages that quote items', () => {
    const out = formatText({ version: 'x', results: [{ file: `a${ESC}.rungs`, problems }] }, true);
    // The only raw ESC bytes left are the formatter's own colours (ESC [ digits m).
    expect(out.replace(/\u001b\[\d+m/g, '')).not.toContain(ESC);
    expect(out).toContain('a\\x1b.rungs');
  });

  it('the dry-run diff escapes changed lines and keeps CRLF endings', () => {
    const d = unifiedDiff('a.rungs', `x${RED}\r\nsame\r\n`, `y${RED}\r\nsame\r\n`);
    expect(d).not.toContain(ESC);
    expect(d).toContain('-x\\x1b[31m\r\n');
  });

  it('end to end: rungs score and rungs lint print no raw escape', async () => {
    const fs = new MemFs({ 'a.rungs': text });
    for (const argv of [['score', 'a.rungs'], ['lint', 'a.rungs'], ['lint', '--fix-dry-run', 'a.rungs']]) {
      let out = '';
      const io: CliIO = { argv, cwd: '/clinic', fs, stdout: (t) => (out += t), stderr: () => {}, env: {} };
      await main(io);
      expect(out.length).toBeGreaterThan(0);
      expect(out).not.toContain(ESC);
    }
  });
});

describe('diff of a large file', () => {
  it('does not build a table of every line pair', () => {
    const before = Array.from({ length: 50_000 }, (_, i) => `line ${i}`).join('\n');
    const after = before.replace('line 25000', 'changed');
    const d = unifiedDiff('a', before, after);
    expect(d).toBe('--- a/a\n+++ b/a\n@@ -24998,7 +24998,7 @@\n line 24997\n line 24998\n line 24999\n-line 25000\n+changed\n line 25001\n line 25002\n line 25003\n');
  });
});

describe('messages quote short excerpts', () => {
  it('a long repeated item and a long rung name are cut to 40 characters', () => {
    const long = `${'Word '.repeat(60)}end.`;
    const text = `== ${'N'.repeat(300)}\n${long}\n${long}\nHi.\n`;
    const ps = lint(analyzeText(text), text, { severities: {} });
    const dup = ps.find((p) => p.rule === 'duplicate-item')!;
    expect(dup.message).toBe(`"${long.slice(0, 39)}…" repeats line 2 in rung 1 "${'N'.repeat(39)}…"`);
  });
});
