// The Mann-Whitney U test (Mann & Whitney 1947, Ann Math Stat 18(1); Wilcoxon 1945). No well-kept
// npm library gives its p-value, so the exact null distribution is computed here; the normal
// tail comes from jstat.
//
// U is reported for sample A: the number of pairs (a, b) with a > b, ties counting one half
// (equal to A's rank sum minus nA(nA + 1)/2, the W of R's wilcox.test).
//
// - Exact: for samples without ties, each of nA, nB at most EXACT_LIMIT, p comes from the exact
//   distribution of U under H0, built by Mann & Whitney's recurrence on probabilities
//   p(u; m, n) = m/(m+n) p(u - n; m - 1, n) + n/(m+n) p(u; m, n - 1),
//   which adds only positive terms (no cancellation, no huge binomial counts).
// - Otherwise: the normal approximation with the tie-corrected variance
//   nA nB / 12 ((N + 1) - sum(t³ - t) / (N (N - 1))) and a continuity correction of 0.5
//   towards the mean.
import { normal } from 'jstat';

export type MwuMethod = 'exact' | 'normal';
export type Alternative = 'two-sided' | 'greater' | 'less';

export interface MwuResult {
  u: number;
  p: number;
  method: MwuMethod;
}

/** Largest sample size for which the exact distribution is used (as R's wilcox.test: n < 50). */
export const EXACT_LIMIT = 49;

// Distributions already built, by sizes: the editor re-checks the same sets on every keystroke,
// and a 49 by 49 table takes some 100 ms to build. The distribution for (m, n) is that for
// (n, m) (U and mn - U have the same law), so one entry serves both orders.
const built = new Map<string, Float64Array>();
const BUILT_LIMIT = 64;

/**
 * Probabilities of U = 0..m·n for samples of m and n values without ties under H0.
 * The table is filled row by row over m; each cell is a probability vector. Callers must not
 * modify the array returned (it is shared).
 */
export function exactUDistribution(m: number, n: number): Float64Array {
  if (!Number.isInteger(m) || !Number.isInteger(n) || m < 0 || n < 0) {
    throw new RangeError(`sample sizes must be whole numbers 0 or more, not ${m} and ${n}`);
  }
  const key = m <= n ? `${m},${n}` : `${n},${m}`;
  let dist = built.get(key);
  if (!dist) {
    dist = buildDistribution(Math.min(m, n), Math.max(m, n));
    if (built.size >= BUILT_LIMIT) built.delete(built.keys().next().value!);
    built.set(key, dist);
  }
  return dist;
}

function buildDistribution(m: number, n: number): Float64Array {
  // prev[j] = distribution for (i - 1, j); cur[j] = for (i, j).
  let prev: Float64Array[] = [];
  for (let j = 0; j <= n; j++) prev.push(Float64Array.of(1)); // m = 0: U is always 0.
  for (let i = 1; i <= m; i++) {
    const cur: Float64Array[] = [Float64Array.of(1)]; // n = 0: U is always 0.
    for (let j = 1; j <= n; j++) {
      const out = new Float64Array(i * j + 1);
      const wa = i / (i + j);
      const wb = j / (i + j);
      // The largest value of A beats all j values of B: U shifts by j.
      const fromA = prev[j];
      for (let u = 0; u < fromA.length; u++) out[u + j] += wa * fromA[u];
      // The largest value belongs to B: it beats nothing in A.
      const fromB = cur[j - 1];
      for (let u = 0; u < fromB.length; u++) out[u] += wb * fromB[u];
      cur.push(out);
    }
    prev = cur;
  }
  return prev[n];
}

function midRanks(values: number[]): { ranks: number[]; tieTerm: number } {
  const order = values.map((v, i) => [v, i] as const).sort((x, y) => x[0] - y[0]);
  const ranks = new Array<number>(values.length);
  let tieTerm = 0;
  for (let s = 0; s < order.length; ) {
    let e = s;
    while (e + 1 < order.length && order[e + 1][0] === order[s][0]) e++;
    const r = (s + e) / 2 + 1;
    for (let k = s; k <= e; k++) ranks[order[k][1]] = r;
    const t = e - s + 1;
    tieTerm += t * t * t - t;
    s = e + 1;
  }
  return { ranks, tieTerm };
}

/** U of sample A (pairs a > b, ties one half) and the tie term sum(t³ - t) of the pooled sample. */
export function uStatistic(a: readonly number[], b: readonly number[]): { u: number; tieTerm: number } {
  const { ranks, tieTerm } = midRanks([...a, ...b]);
  let rankSum = 0;
  for (let i = 0; i < a.length; i++) rankSum += ranks[i];
  return { u: rankSum - (a.length * (a.length + 1)) / 2, tieTerm };
}

/**
 * Mann-Whitney U test of A against B. `greater` tests A tending larger than B. Null when either
 * sample is empty. `forceNormal` is for tests that compare the two methods.
 */
export function mannWhitney(
  a: readonly number[],
  b: readonly number[],
  alternative: Alternative = 'two-sided',
  forceNormal = false,
): MwuResult | null {
  const m = a.length;
  const n = b.length;
  if (m === 0 || n === 0) return null;
  const { u, tieTerm } = uStatistic(a, b);
  if (!forceNormal && tieTerm === 0 && m <= EXACT_LIMIT && n <= EXACT_LIMIT) {
    const dist = exactUDistribution(m, n);
    const k = Math.round(u); // U is a whole number without ties.
    let lower = 0; // P(U <= k)
    for (let i = 0; i <= k; i++) lower += dist[i];
    let upper = 0; // P(U >= k)
    for (let i = k; i < dist.length; i++) upper += dist[i];
    const p = alternative === 'greater' ? upper : alternative === 'less' ? lower : 2 * Math.min(lower, upper);
    return { u, p: Math.min(1, p), method: 'exact' };
  }
  const total = m + n;
  const mean = (m * n) / 2;
  const variance = ((m * n) / 12) * (total + 1 - tieTerm / (total * (total - 1)));
  if (!(variance > 0)) return { u, p: 1, method: 'normal' };
  const sd = Math.sqrt(variance);
  const dev = u - mean;
  let p: number;
  if (alternative === 'greater') p = normal.cdf(-(dev - 0.5) / sd, 0, 1);
  else if (alternative === 'less') p = normal.cdf((dev + 0.5) / sd, 0, 1);
  else {
    // The correction moves U half a unit towards the mean (none when U sits on the mean).
    const z = (dev - Math.sign(dev) * 0.5) / sd;
    p = 2 * normal.cdf(-Math.abs(z), 0, 1);
  }
  return { u, p: Math.min(1, p), method: 'normal' };
}
