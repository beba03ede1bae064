// Two-sample t-tests from summary statistics: Welch's unequal-variance test (the one Rungs
// reports) and Student's pooled test (kept for the published worked examples that quote both).
// Distribution functions come from jstat; nothing here approximates a CDF by hand.
import { studentt } from 'jstat';
import type { Summary } from './summary';

export interface TTestResult {
  /** Mean of A minus mean of B. */
  diff: number;
  /** Standard error of the difference. */
  se: number;
  t: number;
  df: number;
  /** Two-sided p-value. */
  p: number;
}

/** Two-sided p of a t statistic with df degrees of freedom. */
export function twoSidedP(t: number, df: number): number {
  return Math.min(1, 2 * studentt.cdf(-Math.abs(t), df));
}

/**
 * Welch's t-test (Welch 1947, Biometrika 34): t = (mA - mB) / sqrt(sA²/nA + sB²/nB) with the
 * Welch-Satterthwaite degrees of freedom. Null when either sample has fewer than 2 values or
 * both have zero (or vanishingly small) spread: the statistic is undefined then.
 */
export function welch(a: Summary, b: Summary): TTestResult | null {
  if (a.n < 2 || b.n < 2) return null;
  const va = (a.sd * a.sd) / a.n;
  const vb = (b.sd * b.sd) / b.n;
  const se = Math.sqrt(va + vb);
  if (!(se > 0)) return null;
  const diff = a.mean - b.mean;
  const df = ((va + vb) * (va + vb)) / ((va * va) / (a.n - 1) + (vb * vb) / (b.n - 1));
  // Spreads so small that their squares underflow leave the degrees of freedom undefined.
  if (!Number.isFinite(df) || !(df > 0)) return null;
  const t = diff / se;
  return { diff, se, t, df, p: twoSidedP(t, df) };
}

/** The pooled standard deviation (n - 1 weights), NaN when it is undefined. */
export function pooledSd(a: Summary, b: Summary): number {
  const df = a.n + b.n - 2;
  if (df <= 0) return NaN;
  return Math.sqrt(((a.n - 1) * a.sd * a.sd + (b.n - 1) * b.sd * b.sd) / df);
}

/** Student's pooled-variance t-test; null when undefined (as for welch). */
export function pooledT(a: Summary, b: Summary): (TTestResult & { sp: number }) | null {
  if (a.n < 2 || b.n < 2) return null;
  const sp = pooledSd(a, b);
  const se = sp * Math.sqrt(1 / a.n + 1 / b.n);
  if (!(se > 0)) return null;
  const diff = a.mean - b.mean;
  const df = a.n + b.n - 2;
  const t = diff / se;
  return { diff, se, t, df, p: twoSidedP(t, df), sp };
}
