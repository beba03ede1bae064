// Runs the TextMate grammar tests (vscode-tmgrammar-test) over tests/grammar/*.test.rungs, and
// checks that the copies of the sample scripts there still match the scripts they came from once
// their test header and assertion lines are taken out.
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');
const here = join(root, 'tests', 'grammar');
const cli = join(root, 'node_modules', 'vscode-tmgrammar-test', 'dist', 'unit.js');

/** The script a grammar test file was made from: its test lines removed. */
function stripAssertions(text: string): string {
  return text
    .split('\n')
    .slice(1)
    .filter((line) => !/^\/\/\s*(\^|<[~]*-)/.test(line))
    .join('\n');
}

describe('TextMate grammar', () => {
  it('passes every scope assertion in tests/grammar', () => {
    let output = '';
    let status = 0;
    try {
      output = execFileSync(
        process.execPath,
        [cli, '--compact', '-g', join(root, 'grammar', 'rungs.tmLanguage.json'), join(here, '*.test.rungs')],
        { cwd: root, encoding: 'utf8' },
      );
    } catch (e) {
      const err = e as { status: number; stdout: string; stderr: string };
      status = err.status;
      output = err.stdout + err.stderr;
    }
    expect(output, output).not.toMatch(/ERROR|failed/);
    expect(status, output).toBe(0);
  });

  const copies = readdirSync(here).filter((f) => f.endsWith('.test.rungs') && f !== 'format.test.rungs');
  it.each(copies)('%s matches its sample script', (file) => {
    const sample = join(root, 'sample-scripts', file.replace('.test.rungs', '.rungs'));
    expect(existsSync(sample), `${sample} is gone; remove or rename ${file}`).toBe(true);
    const copy = stripAssertions(readFileSync(join(here, file), 'utf8'));
    expect(copy.trimEnd()).toBe(readFileSync(sample, 'utf8').trimEnd());
  });
});
