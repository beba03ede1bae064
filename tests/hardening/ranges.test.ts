// Item 6 of the hardening issue: every numeric setting has a finite, plausible range, and values
// outside it (or numbers JavaScript reads but a person would not write) are problems.
import { describe, expect, it } from 'vitest';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { SETTINGS as KEYS } from '../../server/src/core/settings';
import { NUMBER_RANGES } from '../../server/src/core/ranges';
import { parseConfigText } from '../../server/src/config/parseConfig';
import { applySettings, defaultOptions } from '../../server/src/core/options';
import { lint, renderFindings } from '../../server/src/rules/index';
import { analyzeText } from '../helpers/data';
import { MemFs } from '../cli/memfs';

const ITEMS = '== A\nHi.\nSee you soon.\nThank you very much.\n== B\nMy granddaughter visits every Sunday afternoon.\nPlease pass the bread.\nGood morning.\n';

function settingProblems(line: string) {
  return renderFindings(analyzeText(`${line}\n${ITEMS}`).findings).filter((p) => p.line === 0);
}

describe('numeric settings', () => {
  it.each([
    '@weights Infinity, 1, 1',
    '@weights 1e309 1 1',
    '@weights 0x10, 1, 1',
    '@weights length 1e5',
    `@weights length ${'9'.repeat(400)}`,
    '@baseline 1e20',
    '@baseline 100',
    `@max-step ${'9'.repeat(400)}`,
    '@max-step 101',
    '@min-items 100000',
    '@max-words 1e3',
    '@reading-norm 50',
    `@paces ${'9'.repeat(400)}`,
    `@set-bound ${'9'.repeat(400)}`,
    '@set-bound 11',
    `@set-min-items ${'9'.repeat(400)}`,
  ])('%s is a problem on its line', (line) => {
    const ps = settingProblems(line);
    expect(ps.map((p) => p.rule)).toEqual(['bad-value']);
  });

  it('in-range values are read', () => {
    expect(settingProblems('@weights 0.4, 0.4, 0.2')).toEqual([]);
    expect(settingProblems('@baseline 0.8 wps')).toEqual([]);
    expect(settingProblems('@max-step 100')).toEqual([]);
  });

  it('a benefit mark (a rate-records key, read from config files) is bounded at tenfold', () => {
    // A benefit mark is a ratio of two rates; a mark above tenfold is not plausible (common practice).
    const bad = parseConfigText('{"benefit-mark": 11}', '/p/.rungs.json');
    expect(renderFindings(bad.findings).map((p) => p.rule)).toEqual([]);
    expect(applySettings(defaultOptions(), bad.settings, 'config').findings.map((f) => f.kind)).toEqual(['unreadable-value']);
    const ok = parseConfigText('{"benefit-mark": 10}', '/p/.rungs.json');
    expect(applySettings(defaultOptions(), ok.settings, 'config').findings).toEqual([]);
  });

  it('a rate-records key in a script header is a warning at the key, and changes nothing', () => {
    const ps = settingProblems('@benefit-mark 1.5');
    expect(ps.map((p) => [p.rule, p.severity, p.character])).toEqual([['bad-value', 'warning', 0]]);
    expect(ps[0].message).toContain('config file');
    expect(analyzeText(`@benefit-mark 1.5\n${ITEMS}`).options.records.benefitMark).toBe(1.2);
  });

  it('no difficulty is NaN and no ladder rule speaks of NaN after a bad @weights', () => {
    const text = `@weights Infinity, 1, 1\n${ITEMS}`;
    const a = analyzeText(text);
    expect(a.items.every((i) => Number.isFinite(i.difficulty))).toBe(true);
    expect(lint(a, text, { severities: {} }).some((p) => /NaN/.test(p.message))).toBe(false);
  });

  it('every numeric range is finite and names a known setting', () => {
    for (const [key, r] of Object.entries(NUMBER_RANGES)) {
      expect(KEYS.some((k) => k.key === key)).toBe(true);
      expect(Number.isFinite(r.min) && Number.isFinite(r.max) && r.min < r.max).toBe(true);
    }
  });

  it('config files: a YAML .inf ladder step and a huge value are problems', () => {
    const layer = parseConfigText('ladder:\n  maxStep: .inf\nbaseline: 1e20\n', '/p/.rungs.yaml');
    expect(renderFindings(layer.findings).map((p) => p.line)).toEqual([1]);
    expect(layer.ladder.maxStep).toBeUndefined();
  });
});

describe('--max-warnings', () => {
  async function run(argv: string[]) {
    let err = '';
    const io: CliIO = { argv, cwd: '/clinic', fs: new MemFs({ 'a.rungs': 'Hi.\n' }), stdout: () => {}, stderr: (t) => (err += t), env: {} };
    return { code: await main(io), err };
  }
  it.each(['', '1e3', '0x10', 'Infinity', '-1', '1.5'])('rejects "%s"', async (v) => {
    const r = await run(['lint', 'a.rungs', '--max-warnings', v]);
    expect(r.code).toBe(2);
    expect(r.err).toContain('--max-warnings takes a whole number');
  });
  it('takes 0', async () => {
    expect((await run(['lint', 'a.rungs', '--max-warnings', '0'])).code).toBe(0);
  });
});

describe('the settings table states every range', () => {
  it('grammar/README.md gives each numeric setting its range', async () => {
    const { readFileSync } = await import('node:fs');
    const { join } = await import('node:path');
    const table = readFileSync(join(__dirname, '..', '..', 'grammar', 'README.md'), 'utf8').split('\n');
    const text = table.join('\n');
    for (const [key, r] of Object.entries(NUMBER_RANGES)) {
      // A row of the settings table, or (rate records keys) the sentence that lists them.
      const row = table.find((l) => l.startsWith('|') && l.includes(`\`@${key}\``));
      const where = row ?? text.slice(text.indexOf(`\`${key}\``), text.indexOf(`\`${key}\``) + 80);
      expect(where.length, key).toBeGreaterThan(0);
      expect(where.replace(/\n/g, ' '), key).toContain(`range: ${r.above ? 'above ' : ''}${r.min} to ${r.max}`);
    }
  });
});
