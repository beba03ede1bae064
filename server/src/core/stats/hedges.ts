// Hedges' g, the bias-corrected standardised mean difference, with its approximate 95 %
// confidence interval, as Borenstein, Hedges, Higgins & Rothstein (2009, Introduction to
// Meta-Analysis, ch. 4) compute it from summary data:
//   d = (mA - mB) / s_pooled,   V_d = (nA + nB) / (nA nB) + d² / (2 (nA + nB)),
//   J = 1 - 3 / (4 df - 1) with df = nA + nB - 2,   g = J d,   SE_g = J sqrt(V_d),
//   95 % CI = g ± 1.959964 SE_g.
import { normal } from 'jstat';
import type { Summary } from './summary';
import { pooledSd } from './ttest';

export interface HedgesG {
  d: number;
  j: number;
  g: number;
  se: number;
  low: number;
  high: number;
}

/** Null when either sample has fewer than 2 values or the pooled SD is 0. */
export function hedgesG(a: Summary, b: Summary, level = 0.95): HedgesG | null {
  if (a.n < 2 || b.n < 2) return null;
  const sp = pooledSd(a, b);
  if (!(sp > 0)) return null;
  const n = a.n + b.n;
  const d = (a.mean - b.mean) / sp;
  const vd = n / (a.n * b.n) + (d * d) / (2 * n);
  const j = 1 - 3 / (4 * (n - 2) - 1);
  const g = j * d;
  const se = j * Math.sqrt(vd);
  const z = normal.inv(1 - (1 - level) / 2, 0, 1);
  return { d, j, g, se, low: g - z * se, high: g + z * se };
}
