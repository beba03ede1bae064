// Equivalence by two one-sided tests (TOST; Schuirmann 1987, J Pharmacokinet Biopharm 15(6);
// Lakens 2017, Social Psychological and Personality Science 8(4)) on Welch's t. The sets are
// shown equivalent when both one-sided tests reject at alpha, which is the same as the
// (1 - 2 alpha) confidence interval of the difference lying inside the bounds.
import { studentt } from 'jstat';
import type { Summary } from './summary';
import { welch } from './ttest';

export interface TostResult {
  diff: number;
  se: number;
  df: number;
  /** The bounds in raw units: (-bound, +bound). */
  bound: number;
  /** p of H0: diff <= -bound (the lower one-sided test). */
  pLower: number;
  /** p of H0: diff >= +bound (the upper one-sided test). */
  pUpper: number;
  /** The (1 - 2 alpha) confidence interval of the difference (90 % at alpha .05). */
  ciLow: number;
  ciHigh: number;
  equivalent: boolean;
  /**
   * How far the interval sits inside the bounds, in raw units: bound - max(|ciLow|, |ciHigh|).
   * Positive exactly when the sets are shown equivalent; the balancer maximises its worst value.
   */
  margin: number;
}

/** TOST against raw bounds ±bound; null when Welch's t is undefined. */
export function tostWelch(a: Summary, b: Summary, bound: number, alpha = 0.05): TostResult | null {
  const w = welch(a, b);
  if (!w) return null;
  const { diff, se, df } = w;
  const pLower = 1 - studentt.cdf((diff + bound) / se, df);
  const pUpper = studentt.cdf((diff - bound) / se, df);
  const q = studentt.inv(1 - alpha, df);
  const ciLow = diff - q * se;
  const ciHigh = diff + q * se;
  return {
    diff,
    se,
    df,
    bound,
    pLower,
    pUpper,
    ciLow,
    ciHigh,
    equivalent: pLower < alpha && pUpper < alpha,
    margin: bound - Math.max(Math.abs(ciLow), Math.abs(ciHigh)),
  };
}

/**
 * The SD that turns a bound in SD units into raw units: the root mean of the two variances,
 * sqrt((sA² + sB²) / 2), the standardiser Lakens (2017) uses beside Welch's test.
 */
export function averageSd(a: Summary, b: Summary): number {
  return Math.sqrt((a.sd * a.sd + b.sd * b.sd) / 2);
}
