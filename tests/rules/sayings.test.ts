// The table lint keeps problems in by what they say (server/src/rules/sayings.ts): found only
// under exactly the same JSON, also when two different JSON texts share a number.
import { describe, expect, it } from 'vitest';
import type { Problem } from '../../server/src/core/types';
import { Sayings } from '../../server/src/rules/sayings';

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
    expect(t.find(JSON.stringify(problem('first')))).toBe(a);
    expect(t.find(JSON.stringify(problem('second')))).toBeUndefined();
    expect(t.size).toBe(1);
  });

  it('tells apart two problems whose JSON shares a number', () => {
    // "m5tzx" and "mk3ad" give JSON with the same FNV-1a 32 number (found by a search, computed).
    const a = problem('m5tzx');
    const b = problem('mk3ad');
    expect(fnv(JSON.stringify(a))).toBe(fnv(JSON.stringify(b)));
    const t = new Sayings();
    t.add(JSON.stringify(a), a);
    expect(t.find(JSON.stringify(b))).toBeUndefined();
    t.add(JSON.stringify(b), b);
    expect(t.find(JSON.stringify(problem('m5tzx')))).toBe(a);
    expect(t.find(JSON.stringify(problem('mk3ad')))).toBe(b);
    expect(t.size).toBe(2);
  });
});
