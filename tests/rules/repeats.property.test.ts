// Property: the repeats duplicate-item reports, worked out from an index kept between checks and
// moved by the rungs that changed (server/src/rules/repeats.ts), are exactly those a plain pass
// over the script finds (every item whose general key an earlier item has, named with the first
// such item), after every step of a random sequence of rung changes. Each step rewrites one rung
// and keeps the other rungs' analysis objects, as the language server's incremental path does;
// then with each rung left out in turn; the items include two different keys that share a key number ("word ngwk" and "word nuaab",
// see duplicateKey.property.test.ts), so the index must tell them apart by key.
import { fc, test } from '@fast-check/vitest';
import { expect } from 'vitest';
import type { RungAnalysis } from '../../server/src/core/types';
import { repeatsOf } from '../../server/src/rules/repeats';
import { analyzeText } from '../helpers/data';
import { plainRepeats } from '../helpers/repeats';

const ITEMS = ['Come in.', 'come in!', 'Sit down.', 'sit  down', 'Good morning.', 'Word ngwk.', 'word nuaab', '(Wave.)', 'Thank you.', '...'];
const RUNGS = 4;
const SIZE = 5;

const rungItems = fc.array(fc.constantFrom(...ITEMS), { minLength: SIZE, maxLength: SIZE });

/** Analyses a script of RUNGS rungs of SIZE items each (every rung keeps its lines whatever its items). */
function rungsOf(contents: string[][]): RungAnalysis[] {
  const text = contents.map((items, k) => `== Rung ${k + 1}\n${items.join('\n')}\n`).join('');
  return analyzeText(text).rungs;
}

/** The plain pass: script order, first item of each general key, every later one a repeat of it. */
const expected = (rungs: readonly RungAnalysis[]): [number, number][] => plainRepeats(rungs.flatMap((r) => r.items));

test.prop(
  [
    fc.array(rungItems, { minLength: RUNGS, maxLength: RUNGS }),
    fc.array(fc.record({ rung: fc.integer({ min: 0, max: RUNGS - 1 }), items: rungItems, fresh: fc.boolean() }), { maxLength: 25 }),
  ],
  { numRuns: 200 },
)('the kept index finds the repeats a plain pass finds, after every rung change', (start, steps) => {
  const contents = start.map((c) => [...c]);
  let rungs = rungsOf(contents);
  expect(repeatsOf(rungs).map((p) => [p.item.node.line, p.first.node.line])).toEqual(expected(rungs));
  for (const step of steps) {
    contents[step.rung] = step.items;
    const next = rungsOf(contents);
    // Keep the untouched rungs' objects (the incremental path), or take all new ones (a full analysis).
    rungs = step.fresh ? next : rungs.map((r, k) => (k === step.rung ? next[k] : r));
    expect(repeatsOf(rungs).map((p) => [p.item.node.line, p.first.node.line])).toEqual(expected(rungs));
  }
  // Lists with a rung fewer, sharing every other rung object: the index is found and rebuilt.
  for (let k = 0; k < rungs.length; k++) {
    const fewer = rungs.filter((_, i) => i !== k);
    expect(repeatsOf(fewer).map((p) => [p.item.node.line, p.first.node.line])).toEqual(expected(fewer));
    expect(repeatsOf(rungs).map((p) => [p.item.node.line, p.first.node.line])).toEqual(expected(rungs));
  }
});
