// The exact null distribution of the Mann-Whitney U statistic, the one distribution Rungs computes
// itself, checked against brute-force enumeration, its known moments and published table values.
import { describe, expect, it } from 'vitest';
import { EXACT_LIMIT, exactUDistribution, mannWhitney, uStatistic } from '../../server/src/core/stats';

/** Enumerates every way to give m of the ranks 1..m+n to sample A (computed by brute force). */
function bruteForce(m: number, n: number): number[] {
  const total = m + n;
  const counts = new Array<number>(m * n + 1).fill(0);
  let ways = 0;
  for (let mask = 0; mask < 1 << total; mask++) {
    let bits = 0;
    let rankSum = 0;
    for (let i = 0; i < total; i++) {
      if (mask & (1 << i)) {
        bits++;
        rankSum += i + 1;
      }
    }
    if (bits !== m) continue;
    counts[rankSum - (m * (m + 1)) / 2]++;
    ways++;
  }
  return counts.map((c) => c / ways);
}

describe('exact U distribution', () => {
  it('equals brute-force enumeration for every pair of sizes with m + n <= 14 (computed)', () => {
    for (let m = 0; m <= 14; m++) {
      for (let n = 0; m + n <= 14; n++) {
        const dist = Array.from(exactUDistribution(m, n));
        const brute = bruteForce(m, n);
        expect(dist.length).toBe(brute.length);
        dist.forEach((p, u) => expect(p).toBeCloseTo(brute[u], 14));
      }
    }
  });

  it('gives whole-number counts times 1 / C(m+n, m): m = n = 4 has C(8,4) = 70 arrangements (computed)', () => {
    const counts = Array.from(exactUDistribution(4, 4)).map((p) => p * 70);
    for (const c of counts) expect(Math.abs(c - Math.round(c))).toBeLessThan(1e-9);
    // Counts of U = 0..16 for m = n = 4: the Gaussian binomial [8 choose 4] (computed).
    expect(counts.map(Math.round)).toEqual([1, 1, 2, 3, 5, 5, 7, 7, 8, 7, 7, 5, 5, 3, 2, 1, 1]);
  });

  it('sums to 1, is symmetric, and has mean mn/2 and variance mn(N+1)/12 up to the exact limit', () => {
    // Moments of U under H0 without ties (Mann & Whitney 1947).
    for (const [m, n] of [[1, 1], [3, 7], [12, 5], [20, 20], [EXACT_LIMIT, EXACT_LIMIT], [EXACT_LIMIT, 2]]) {
      const dist = exactUDistribution(m, n);
      let sum = 0;
      let mean = 0;
      for (let u = 0; u < dist.length; u++) {
        sum += dist[u];
        mean += u * dist[u];
      }
      let variance = 0;
      for (let u = 0; u < dist.length; u++) variance += (u - mean) * (u - mean) * dist[u];
      expect(sum).toBeCloseTo(1, 12);
      expect(mean).toBeCloseTo((m * n) / 2, 9);
      expect(variance).toBeCloseTo((m * n * (m + n + 1)) / 12, 6);
      for (let u = 0; u < dist.length; u++) expect(dist[u]).toBeCloseTo(dist[dist.length - 1 - u], 14);
    }
  });

  it('matches two-sided .05 critical values of published U tables (from memory)', () => {
    // Critical U (reject when U <= value, two-sided alpha .05): n1 = n2 = 5: 2; 8: 13; 10: 23; 20: 127.
    for (const [n, crit] of [[5, 2], [8, 13], [10, 23], [20, 127]]) {
      const dist = exactUDistribution(n, n);
      let lower = 0;
      for (let u = 0; u <= crit; u++) lower += dist[u];
      expect(lower).toBeLessThanOrEqual(0.025);
      expect(lower + dist[crit + 1]).toBeGreaterThan(0.025);
    }
  });

  it('rejects sizes that are not whole numbers', () => {
    expect(() => exactUDistribution(1.5, 2)).toThrow(RangeError);
    expect(() => exactUDistribution(-1, 2)).toThrow(RangeError);
  });
});

describe('Mann-Whitney test', () => {
  it('counts pairs a > b with ties as halves (computed by hand)', () => {
    expect(uStatistic([3, 4], [1, 2]).u).toBe(4);
    expect(uStatistic([1, 2], [3, 4]).u).toBe(0);
    expect(uStatistic([2, 3], [2, 1]).u).toBe(3.5);
  });

  it('uses the exact method only without ties and within the size limit', () => {
    expect(mannWhitney([1, 2, 3], [4, 5])!.method).toBe('exact');
    expect(mannWhitney([1, 2, 3], [3, 5])!.method).toBe('normal');
    const big = Array.from({ length: EXACT_LIMIT + 1 }, (_, i) => i * 2);
    expect(mannWhitney(big, [1, 3, 5])!.method).toBe('normal');
  });

  it('complete separation of 3 and 3 values: exact two-sided p = 2/20 (computed: 1 of C(6,3))', () => {
    expect(mannWhitney([1, 2, 3], [4, 5, 6])!.p).toBeCloseTo(0.1, 14);
  });

  it('is null for an empty sample and p = 1 when every value is tied', () => {
    expect(mannWhitney([], [1])).toBeNull();
    expect(mannWhitney([2, 2], [2, 2, 2])!.p).toBe(1);
  });

  it('exact and normal p agree closely on large untied samples (normal limit; computed)', () => {
    const a = Array.from({ length: 40 }, (_, i) => i * 2 + 0.5);
    const b = Array.from({ length: 40 }, (_, i) => i * 2 + (i % 3 === 0 ? 3.25 : 0.75));
    const exact = mannWhitney(a, b)!;
    const approx = mannWhitney(a, b, 'two-sided', true)!;
    expect(exact.method).toBe('exact');
    expect(Math.abs(exact.p - approx.p)).toBeLessThan(0.01);
  });
});
