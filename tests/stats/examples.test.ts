// The set-comparison statistics against published worked examples. Each check names its source.
import { describe, expect, it } from 'vitest';
import {
  hedgesG,
  mannWhitney,
  pooledT,
  summarize,
  tostWelch,
  welch,
  type Summary,
} from '../../server/src/core/stats';

// Student 1908, Biometrika 6(1): extra hours of sleep under two drugs (the "sleep" data).
const sleep1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const sleep2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

describe("Welch's t-test", () => {
  it('Student 1908 sleep data, groups treated as independent: t -1.8608, df 17.776, p 0.07939', () => {
    // Values computed and reproduced by two independent libraries (named in the issue).
    const w = welch(summarize(sleep1), summarize(sleep2))!;
    expect(w.t).toBeCloseTo(-1.8608, 4);
    expect(w.df).toBeCloseTo(17.776, 3);
    expect(w.p).toBeCloseTo(0.07939, 5);
  });

  it('NIST/SEMATECH e-Handbook 1.3.5.3 (AUTO83B, US vs Japanese cars) from summary statistics', () => {
    const us: Summary = { n: 249, mean: 20.14458, sd: 6.4147 };
    const japan: Summary = { n: 79, mean: 30.48101, sd: 6.10771 };
    const pooled = pooledT(us, japan)!;
    expect(pooled.t).toBeCloseTo(-12.6206, 3); // pooled T = -12.62059
    expect(pooled.sp).toBeCloseTo(6.3426, 4); // sp = 6.34260
    const w = welch(us, japan)!;
    expect(w.t).toBeCloseTo(-12.946, 3); // Welch T = -12.94627
    expect(w.df).toBeCloseTo(136.87, 2); // df = 136.8750
  });

  it('is undefined (null) for a sample of one or two constant samples', () => {
    expect(welch(summarize([1]), summarize([1, 2, 3]))).toBeNull();
    expect(welch(summarize([2, 2]), summarize([3, 3]))).toBeNull();
  });
});

describe('Mann-Whitney U', () => {
  // Hollander & Wolfe 1973, Nonparametric Statistical Methods, p. 69 (from memory, reproduced by
  // computation): permeability data, x against y.
  const x = [0.8, 0.83, 1.89, 1.04, 1.45, 1.38, 1.91, 1.64, 0.73, 1.46];
  const y = [1.15, 0.88, 0.9, 0.74, 1.21];

  it('Hollander & Wolfe 1973 p. 69: U = 35, exact one-sided p (x > y) 0.1272, two-sided 0.2544', () => {
    const greater = mannWhitney(x, y, 'greater')!;
    expect(greater.u).toBe(35);
    expect(greater.method).toBe('exact');
    expect(greater.p).toBeCloseTo(0.1272, 4);
    const two = mannWhitney(x, y)!;
    expect(two.p).toBeCloseTo(0.2544, 4);
    expect(two.method).toBe('exact');
  });

  it('Hollander & Wolfe 1973 p. 69: normal approximation with continuity correction 0.1223', () => {
    const r = mannWhitney(x, y, 'greater', true)!;
    expect(r.method).toBe('normal');
    expect(r.p).toBeCloseTo(0.1223, 4);
  });

  it('Student 1908 sleep data (ties): W = 25.5, two-sided p 0.06933 by the corrected normal approximation', () => {
    const r = mannWhitney(sleep1, sleep2)!;
    expect(r.u).toBe(25.5);
    expect(r.method).toBe('normal');
    expect(r.p).toBeCloseTo(0.06933, 5);
  });

  it('swapping the samples turns U into nA nB - U with the same two-sided p', () => {
    const ab = mannWhitney(x, y)!;
    const ba = mannWhitney(y, x)!;
    expect(ba.u).toBe(x.length * y.length - ab.u);
    expect(ba.p).toBeCloseTo(ab.p, 12);
  });
});

describe('TOST equivalence on Welch t', () => {
  // NCSS two-sample equivalence example (raw bounds ±110, alpha .025); values computed.
  const a = [452, 874, 554, 447, 356, 754, 558, 574, 664, 682, 547, 435, 245];
  const b = [546, 547, 774, 465, 459, 665, 467, 365, 589, 534, 456, 651, 654, 665, 546, 537];

  it('NCSS example: diff -8.1154, SE 53.6185, df 19.169, p 0.03628 and 0.02002', () => {
    const r = tostWelch(summarize(a), summarize(b), 110, 0.025)!;
    expect(r.diff).toBeCloseTo(-8.1154, 4);
    expect(r.se).toBeCloseTo(53.6185, 4);
    expect(r.df).toBeCloseTo(19.169, 3);
    expect(r.pLower).toBeCloseTo(0.03628, 5);
    expect(r.pUpper).toBeCloseTo(0.02002, 5);
    // At alpha .025 the lower test fails (0.036 > 0.025): not shown equivalent.
    expect(r.equivalent).toBe(false);
    expect(r.margin).toBeLessThan(0);
    // At alpha .05 both one-sided tests reject: equivalent, the 90 % CI inside ±110 (computed).
    const at05 = tostWelch(summarize(a), summarize(b), 110, 0.05)!;
    expect(at05.equivalent).toBe(true);
    expect(at05.ciLow).toBeGreaterThan(-110);
    expect(at05.ciHigh).toBeLessThan(110);
    expect(at05.margin).toBeGreaterThan(0);
  });
});

describe("Hedges' g", () => {
  it('Borenstein et al. 2009 ch. 4 (from memory): 103/5.5/50 vs 100/4.5/50', () => {
    const g = hedgesG({ n: 50, mean: 103, sd: 5.5 }, { n: 50, mean: 100, sd: 4.5 })!;
    expect(g.d).toBeCloseTo(0.597, 4);
    expect(g.j).toBeCloseTo(0.9923, 4);
    expect(g.g).toBeCloseTo(0.5924, 4);
    expect(g.se).toBeCloseTo(0.2028, 4);
    // 95 % CI g ± 1.96 SE (computed from the values above).
    expect(g.low).toBeCloseTo(0.5924 - 1.959964 * 0.2028, 3);
    expect(g.high).toBeCloseTo(0.5924 + 1.959964 * 0.2028, 3);
  });
});
