// The set balancer: deterministic for a seed, changes nothing but `@set` labels, keeps each rung's
// items and set sizes, and never leaves the worst equivalence margin worse than it found it
// (fast-check properties over generated scripts; the scripts are invented test data).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { balanceSets } from '../../server/src/core/balance';
import { parseScript } from '../../server/src/core/parse';
import { compareSets } from '../../server/src/core/sets';
import { applyFixes } from '../../server/src/rules/fixes';
import { MemFs } from '../cli/memfs';
import { analyzeText } from '../helpers/data';

const root = join(__dirname, '..', '..');
const kitchen = readFileSync(join(root, 'sample-scripts', 'kitchen-sets.rungs'), 'utf8');

const WORDS = ['tea', 'milk', 'bread', 'please', 'pass', 'the', 'butter', 'kettle', 'spoon', 'orange', 'juice', 'morning', 'visit', 'sister', 'garden', 'umbrella', 'telephone', 'chocolate', 'wash', 'cup'];

/** Everything of a script but the label text of its items: what the balancer must not touch. */
function withoutLabels(text: string): unknown {
  const p = parseScript(text);
  return {
    lines: text.split('\n').map((l) => l.replace(/@set\s+[^@#\s]+/g, '@set _')),
    items: p.rungs.map((r) => r.items.map((i) => ({ line: i.line, text: i.text, id: i.id, note: i.note }))),
  };
}

const worst = (text: string, scope: 'script' | 'rung') =>
  Math.min(Infinity, ...compareSets(analyzeText(text), { setScope: scope, setMinItems: 2 }).pairs.map((p) => p.worstMargin));

const script = fc
  .record({
    scope: fc.constantFrom('script' as const, 'rung' as const),
    labels: fc.constantFrom(['a', 'b'], ['trained', 'untrained', 'control']),
    rungs: fc.array(
      fc.array(
        fc.record({
          words: fc.array(fc.constantFrom(...WORDS), { minLength: 1, maxLength: 7 }),
          label: fc.nat(2),
          note: fc.option(fc.constantFrom('warm up', 'photo card 3'), { nil: null }),
          id: fc.option(fc.integer({ min: 1, max: 999 }), { nil: null }),
          inherit: fc.boolean(),
        }),
        { minLength: 4, maxLength: 10 },
      ),
      { minLength: 1, maxLength: 3 },
    ),
  })
  .map(({ scope, labels, rungs }) => {
    const lines = [`@set-scope ${scope}`, '@set-min-items 2'];
    rungs.forEach((items, r) => {
      lines.push(`== Rung ${r + 1}`);
      items.forEach((it, k) => {
        const text = `${it.words.join(' ')} ${k}.`;
        // The format's order: note, id, then set labels (grammar/README.md).
        const trailer = [it.note ?? '', it.id !== null ? `#i${r}-${k}-${it.id}` : '', it.inherit ? '' : `@set ${labels[it.label % labels.length]}`].filter(Boolean).join(' ');
        lines.push(trailer ? `${text} | ${trailer}` : text);
      });
    });
    return { scope, text: `${lines.join('\n')}\n` };
  });

describe('balanceSets (fast-check)', () => {
  it('changes only labels, keeps set sizes per rung, never worsens the worst margin, and repeats for a seed', () => {
    let proposals = 0;
    fc.assert(
      fc.property(script, fc.integer({ min: 0, max: 1000 }), ({ scope, text }, seed) => {
        const analysis = analyzeText(text);
        const r = balanceSets(analysis, text, { seed, iterations: 300 });
        const fixed = applyFixes(text, [{ title: 'balance', edits: r.edits }]).text;
        expect(withoutLabels(fixed)).toEqual(withoutLabels(text));
        const sizes = (t: string) => analyzeText(t).rungs.map((rg) => rg.items.map((i) => i.sets.join('+')).sort());
        expect(sizes(fixed)).toEqual(sizes(text));
        expect(worst(fixed, scope)).toBeGreaterThanOrEqual(worst(text, scope));
        if (r.changes.length) {
          proposals++;
          expect(r.worstAfter).toBeGreaterThan(r.worstBefore);
        }
        const again = balanceSets(analyzeText(text), text, { seed, iterations: 300 });
        expect(again.edits).toEqual(r.edits);
      }),
      { seed: 42, numRuns: 40 },
    );
    // The properties are only worth something if the search did propose changes in many runs.
    expect(proposals).toBeGreaterThan(10);
  });

  it('improves the sample script and moves only items with their own single label', () => {
    const a = analyzeText(kitchen);
    const r = balanceSets(a, kitchen, { seed: 1 });
    expect(r.changes.length).toBeGreaterThan(0);
    expect(r.worstAfter).toBeGreaterThan(r.worstBefore);
    for (const c of r.changes) expect(a.items.find((i) => i.node.line === c.line)!.node.sets).toEqual([c.from]);
    // Restricted to one rung, only that rung's labels change.
    const one = balanceSets(a, kitchen, { seed: 1, rungs: [2] });
    for (const c of one.changes) expect(a.items.find((i) => i.node.line === c.line)!.rung).toBe(2);
  });
});

describe('rungs sets --balance', () => {
  async function run(argv: string[], fs: MemFs) {
    let out = '';
    let err = '';
    const code = await main({ argv, cwd: '/clinic', fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {} } as CliIO);
    return { code, out, err };
  }

  it('prints before and after tables and writes nothing without --fix', async () => {
    const fs = new MemFs({ 'k.rungs': kitchen });
    const r = await run(['sets', 'k.rungs', '--balance', '--seed', '3'], fs);
    expect(r.code).toBe(0);
    expect(r.out).toContain('Before:');
    expect(r.out).toContain('After:');
    expect(fs.writes).toEqual([]);
  });

  it('--fix writes only @set label changes: item text, notes and ids stay byte-identical', async () => {
    const fs = new MemFs({ 'k.rungs': kitchen });
    const j = JSON.parse((await run(['sets', 'k.rungs', '--balance', '--format', 'json'], fs)).out);
    await run(['sets', 'k.rungs', '--balance', '--fix'], fs);
    const fixed = fs.readFile('/clinic/k.rungs');
    expect(fixed).not.toBe(kitchen);
    expect(withoutLabels(fixed)).toEqual(withoutLabels(kitchen));
    const changed = fixed.split('\n').map((l, i) => (l === kitchen.split('\n')[i] ? null : i + 1)).filter((x) => x !== null);
    expect(changed).toEqual(j.changes.map((c: { line: number }) => c.line));
    expect(worst(fixed, 'script')).toBeGreaterThan(worst(kitchen, 'script'));
  });

  it('rejects --fix without --balance and a seed that is not a number', async () => {
    const fs = new MemFs({ 'k.rungs': kitchen });
    expect((await run(['sets', 'k.rungs', '--fix'], fs)).code).toBe(2);
    expect((await run(['sets', 'k.rungs', '--balance', '--seed', 'x'], fs)).code).toBe(2);
  });
});
