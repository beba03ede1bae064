// Welch's t against an independent implementation (@stdlib/stats-ttest2, a test-only dependency)
// on seeded random sets, and the swap properties the set comparison relies on (fast-check).
import fc from 'fast-check';
import ttest2 from '@stdlib/stats-ttest2';
import { describe, expect, it } from 'vitest';
import { seededRandom as rng } from '../../server/src/core/balance';
import { hedgesG, mannWhitney, summarize, tostWelch, welch } from '../../server/src/core/stats';

describe('Welch t agrees with @stdlib/stats-ttest2 to 1e-6', () => {
  it('on 200 seeded random pairs of sets (sizes 2-40, mixed spreads and shifts)', () => {
    const r = rng(20240611);
    for (let k = 0; k < 200; k++) {
      const na = 2 + Math.floor(r() * 39);
      const nb = 2 + Math.floor(r() * 39);
      const shift = (r() - 0.5) * 4;
      const spread = 0.2 + r() * 5;
      const a = Array.from({ length: na }, () => r() * 10);
      const b = Array.from({ length: nb }, () => shift + r() * 10 * spread);
      const ours = welch(summarize(a), summarize(b))!;
      const ref = ttest2(a, b);
      expect(Math.abs(ours.t - ref.statistic)).toBeLessThan(1e-6);
      expect(Math.abs(ours.df - ref.df)).toBeLessThan(1e-6);
      expect(Math.abs(ours.p - ref.pValue)).toBeLessThan(1e-6);
    }
  });
});

const sample = fc.array(fc.double({ min: -100, max: 100, noNaN: true, noDefaultInfinity: true }), { minLength: 2, maxLength: 25 });

describe('swapping the two sets (fast-check)', () => {
  it('negates g and t, leaves df and the p-values unchanged, swaps the TOST p-values', () => {
    fc.assert(
      fc.property(sample, sample, (a, b) => {
        const sa = summarize(a);
        const sb = summarize(b);
        const ab = welch(sa, sb);
        const ba = welch(sb, sa);
        if (!ab || !ba) return ab === ba;
        expect(ba.t).toBeCloseTo(-ab.t, 9);
        expect(ba.df).toBeCloseTo(ab.df, 9);
        expect(ba.p).toBeCloseTo(ab.p, 12);
        const gab = hedgesG(sa, sb);
        const gba = hedgesG(sb, sa);
        if (gab && gba) {
          expect(gba.g).toBeCloseTo(-gab.g, 9);
          expect(gba.low).toBeCloseTo(-gab.high, 9);
        }
        const tab = tostWelch(sa, sb, 1)!;
        const tba = tostWelch(sb, sa, 1)!;
        expect(tba.pLower).toBeCloseTo(tab.pUpper, 9);
        expect(tba.equivalent).toBe(tab.equivalent);
        const mab = mannWhitney(a, b)!;
        const mba = mannWhitney(b, a)!;
        expect(mba.u).toBeCloseTo(a.length * b.length - mab.u, 9);
        expect(mba.p).toBeCloseTo(mab.p, 12);
        return true;
      }),
      { seed: 11, numRuns: 300 },
    );
  });
});
