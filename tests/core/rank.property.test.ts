// Property: ranking a rung's items from its sorted difficulties (one more than the number of easier
// items) gives exactly the ranks of sorting the items by difficulty then line, with ties sharing
// the lower rank. The reference is the general sort-based ranking, so any difference is a fault of
// the search.
import { fc, test } from '@fast-check/vitest';
import { expect } from 'vitest';
import { rankItems, rankSorted } from '../../server/src/core/analyze';
import type { ItemAnalysis } from '../../server/src/core/types';

// Difficulties as analysis makes them: 0 to 100 in tenths, with many ties, and -0.
const difficulty = fc.oneof(fc.integer({ min: 0, max: 1000 }).map((k) => k / 10), fc.constantFrom(0, -0, 12.5, 50));
const items = (ds: number[]) => ds.map((difficulty, line) => ({ difficulty, node: { line }, rank: 0 }) as unknown as ItemAnalysis);

test.prop([fc.array(difficulty, { maxLength: 60 })], { numRuns: 2000 })('ranks from sorted difficulties equal the general ranking', (ds) => {
  const a = items(ds);
  const b = items(ds);
  rankItems(a);
  rankSorted(b, Float64Array.from(ds).sort());
  expect(b.map((i) => i.rank)).toEqual(a.map((i) => i.rank));
});
