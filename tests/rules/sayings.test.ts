// The table lint keeps problems in by what they say (server/src/rules/sayings.ts): found only
// under exactly the same JSON, also when two different JSON texts share a number.
import { describe, expect, it } from 'vitest';
import type { Problem } from '../../server/src/core/types';
import { fc, test } from '@fast-check/vitest';
import { Sayings, sameJson } from '../../server/src/rules/sayings';

const problem = (message: string): Problem => ({ line: 1, character: 0, endLine: 1, endCharacter: 4, message, rule: 'item-outlier', severity: 'warning' });

/** FNV-1a 32 as published (offset basis 2166136261, prime 16777619; from memory), over UTF-16 units. */
function fnv(text: string): number {
  let h = 2166136261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16777619);
  return h >>> 0;
}

describe('problems kept by what they say', () => {
  it('finds a problem only under its own JSON', () => {
    const t = new Sayings();
    const a = problem('first');
    t.add(JSON.stringify(a), a);
    expect(t.find(JSON.stringify(problem('first')), problem('first'))).toBe(a);
    expect(t.find(JSON.stringify(problem('second')), problem('second'))).toBeUndefined();
    expect(t.size).toBe(1);
  });

  it('tells apart two problems whose JSON shares a number', () => {
    // "m5tzx" and "mk3ad" give JSON with the same FNV-1a 32 number (found by a search, computed).
    const a = problem('m5tzx');
    const b = problem('mk3ad');
    expect(fnv(JSON.stringify(a))).toBe(fnv(JSON.stringify(b)));
    const t = new Sayings();
    t.add(JSON.stringify(a), a);
    expect(t.find(JSON.stringify(b), b)).toBeUndefined();
    t.add(JSON.stringify(b), b);
    expect(t.find(JSON.stringify(problem('m5tzx')), problem('m5tzx'))).toBe(a);
    expect(t.find(JSON.stringify(problem('mk3ad')), problem('mk3ad'))).toBe(b);
    expect(t.size).toBe(2);
  });
});

// sameJson stands for comparing the two values' JSON: on arbitrary JSON-like values (with
// undefined members and holes, which JSON leaves out or writes as null) the two must agree.
const value = fc.letrec((tie) => ({
  v: fc.oneof(
    { depthSize: 'small' },
    fc.constantFrom(null, true, false, 0, 1, -1, 2.5, 'a', 'b', '', undefined),
    fc.array(tie('v'), { maxLength: 3 }),
    fc.dictionary(fc.constantFrom('a', 'b', 'c'), tie('v'), { maxKeys: 3 }),
  ),
})).v;
test.prop([value, value], { numRuns: 3000 })('sameJson agrees with comparing JSON', (a, b) => {
  expect(sameJson(a, b)).toBe(JSON.stringify(a) === JSON.stringify(b));
  expect(sameJson(a, structuredClone(a))).toBe(true);
});
