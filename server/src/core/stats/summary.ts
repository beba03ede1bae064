// Descriptive statistics of one sample: n, mean and the sample standard deviation (n - 1 divisor).
// Pure arithmetic; empty samples give NaN rather than throwing, so callers decide what to show.

export interface Summary {
  n: number;
  mean: number;
  /** Sample standard deviation (divisor n - 1); NaN when n < 2. */
  sd: number;
}

export function summarize(values: readonly number[]): Summary {
  const n = values.length;
  if (n === 0) return { n: 0, mean: NaN, sd: NaN };
  let sum = 0;
  for (const v of values) sum += v;
  const mean = sum / n;
  // Two-pass variance: the sum of squared deviations avoids the cancellation of sum(x^2) - n*mean^2.
  let ss = 0;
  for (const v of values) ss += (v - mean) * (v - mean);
  return { n, mean, sd: n > 1 ? Math.sqrt(ss / (n - 1)) : NaN };
}
