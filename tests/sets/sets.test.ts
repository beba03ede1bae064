// The set comparison over analysed scripts and `rungs sets`. The statistics themselves are checked
// against published examples in tests/stats; here the checks are that the right items reach them
// and that every output carries the same numbers.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { compareSets, SET_METRICS } from '../../server/src/core/sets';
import { balanceRows } from '../../server/src/core/setTable';
import { hedgesG, summarize, welch } from '../../server/src/core/stats';
import { MemFs } from '../cli/memfs';
import { analyzeText } from '../helpers/data';
import { renderFindings } from '../../server/src/rules/index';

const root = join(__dirname, '..', '..');
const kitchen = readFileSync(join(root, 'sample-scripts', 'kitchen-sets.rungs'), 'utf8');

async function run(argv: string[], fs: MemFs, extra: Partial<CliIO> = {}) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: '/clinic', fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {}, ...extra });
  return { code, out, err };
}

describe('compareSets', () => {
  const a = analyzeText(kitchen);

  it('compares the labelled items of the whole script on every metric of the table', () => {
    const c = compareSets(a);
    expect(c.labels).toEqual(['trained', 'untrained']);
    expect(c.pairs).toHaveLength(1);
    const p = c.pairs[0];
    const trained = a.items.filter((i) => i.sets.includes('trained'));
    const untrained = a.items.filter((i) => i.sets.includes('untrained'));
    expect(p.linesA).toEqual(trained.map((i) => i.node.line));
    expect(Object.keys(p.metrics)).toEqual(SET_METRICS.map((m) => m.id));
    for (const m of SET_METRICS) {
      const sa = summarize(trained.map(m.value));
      const sb = summarize(untrained.map(m.value));
      const x = p.metrics[m.id];
      expect(x.meanA).toBeCloseTo(sa.mean, 12);
      expect(x.welchT).toBeCloseTo(welch(sa, sb)!.t, 12);
      expect(x.g).toBeCloseTo(hedgesG(sa, sb)!.g, 12);
      // The verdict is the TOST result: equivalent exactly when the 90 % CI lies inside the bound.
      expect(x.equivalent).toBe(x.ciLow! > -x.boundRaw && x.ciHigh! < x.boundRaw);
      expect(x.margin > 0).toBe(x.equivalent);
    }
    expect(p.worstMargin).toBe(Math.min(...Object.values(p.metrics).map((x) => x.margin)));
  });

  it('rung by rung: every rung holds both sets, each too small under the default minimum', () => {
    const c = compareSets(a, { setScope: 'rung' });
    expect(c.pairs).toHaveLength(0);
    expect(c.small.map((s) => `${s.rung}:${s.label}:${s.n}`)).toEqual([
      '0:trained:3', '0:untrained:2', '1:trained:2', '1:untrained:2', '2:trained:2', '2:untrained:2', '3:trained:2', '3:untrained:2',
    ]);
    const two = compareSets(a, { setScope: 'rung', setMinItems: 2 });
    expect(two.pairs.map((p) => p.rung)).toEqual([0, 1, 2, 3]);
  });

  it('compares nothing with fewer than two labels', () => {
    const c = compareSets(analyzeText('== A\nTea. | @set x\nMilk. | @set x\n'));
    expect(c.pairs).toEqual([]);
    expect(c.small).toEqual([]);
  });

  it('gives two constant, equal sets the verdict equivalent and no t statistic', () => {
    const text = ['@set-min-items 2', '== A', 'Tea. | @set x', 'Milk. | @set y', 'Soup. | @set x', 'Rice. | @set y'].join('\n');
    const x = compareSets(analyzeText(text)).pairs[0].metrics.words;
    expect(x.welchT).toBeNull();
    expect(x.equivalent).toBe(true);
    expect(balanceRows(compareSets(analyzeText(text)).pairs[0])[0]).toMatchObject({ metric: 'words', welch: '—', verdict: 'equivalent' });
  });
});

describe('set settings', () => {
  it('reads @set-bound, @set-min-items and @set-scope from the header', () => {
    const a = analyzeText('@set-bound 0.3\n@set-min-items 4\n@set-scope rung\nTea.\n');
    expect([a.options.setBound, a.options.setMinItems, a.options.setScope]).toEqual([0.3, 4, 'rung']);
  });

  it('reports unreadable values at their line and column', () => {
    const a = analyzeText('@set-bound wide\n@set-min-items 1\n@set-scope item\nTea.\n');
    expect(renderFindings(a.findings).map((p) => `${p.rule} ${p.line}:${p.character}`)).toEqual(['bad-value 0:11', 'bad-value 1:15', 'bad-value 2:11']);
  });
});

describe('rungs sets', () => {
  it('prints the JSON schema of the README with the same numbers as the core', async () => {
    const fs = new MemFs({ 'k.rungs': kitchen });
    const r = await run(['sets', 'k.rungs', '--format', 'json'], fs);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.file).toBe('k.rungs');
    expect(j.scope).toBe('script');
    expect(j.pairs[0]).toMatchObject({ a: 'trained', b: 'untrained', rung: null });
    const words = j.pairs[0].metrics.words;
    expect(Object.keys(words)).toEqual(expect.arrayContaining(['nA', 'nB', 'meanA', 'meanB', 'sdA', 'sdB', 'g', 'gLow', 'gHigh', 'welchT', 'welchDf', 'welchP', 'mwuU', 'mwuP', 'mwuMethod', 'tostPLower', 'tostPUpper', 'equivalent']));
    const core = compareSets(analyzeText(kitchen)).pairs[0].metrics.words;
    expect(words.welchP).toBeCloseTo(core.welchP!, 6);
    expect(j.problems.filter((p: { rule: string }) => p.rule === 'unmatched-sets')).toHaveLength(7);
  });

  it('--by rung overrides the script and reports the small sets; CSV has one row per metric', async () => {
    const fs = new MemFs({ 'k.rungs': kitchen });
    const j = JSON.parse((await run(['sets', 'k.rungs', '--by', 'rung', '--format', 'json'], fs)).out);
    expect(j.scope).toBe('rung');
    expect(j.smallSets).toHaveLength(8);
    expect(j.problems.every((p: { rule: string }) => p.rule === 'small-set')).toBe(true);
    const csv = (await run(['sets', 'k.rungs', '--format', 'csv'], fs)).out.trim().split('\n');
    expect(csv).toHaveLength(1 + SET_METRICS.length);
    expect(csv[1].startsWith('k.rungs,script,,trained,untrained,words,9,8,')).toBe(true);
  });

  it('prints a table with the caution, and exits 2 on usage errors or a missing file', async () => {
    const fs = new MemFs({ 'k.rungs': kitchen });
    const t = await run(['sets', 'k.rungs'], fs);
    expect(t.out).toContain('trained vs untrained, whole script');
    expect(t.out).toContain('Caution:');
    expect((await run(['sets'], fs)).code).toBe(2);
    expect((await run(['sets', 'k.rungs', '--by', 'item'], fs)).code).toBe(2);
    const missing = await run(['sets', 'nope.rungs'], fs);
    expect(missing.code).toBe(2);
    expect(missing.err).toContain('nope.rungs');
  });
});
