// Exact arithmetic on the decimals people write in records ("12", "10.5", "1.2"), so a ratio of
// exactly 1.2 meets a 1.2 mark: 12 words in 10 s against 10 words in 10 s is 1.2 in fractions,
// while 1.2 / 1 in floating point is not guaranteed to compare equal after other operations.

/** A fraction n/d with d > 0. */
export interface Q {
  n: bigint;
  d: bigint;
}

/** A plain decimal ("12", "-3.5", ".25", "1e-7" is not accepted) as a fraction, or null. */
export function decimal(text: string): Q | null {
  const m = /^\s*([+-]?)(\d*)(?:\.(\d*))?\s*$/.exec(text);
  if (!m || (m[2] === '' && (m[3] ?? '') === '')) return null;
  const frac = m[3] ?? '';
  const n = BigInt(`${m[2] || '0'}${frac}`) * (m[1] === '-' ? -1n : 1n);
  return { n, d: 10n ** BigInt(frac.length) };
}

/** A JavaScript number as the fraction of its shortest decimal form (1.2 -> 12/10). */
export function fromNumber(x: number): Q {
  const s = String(x);
  return decimal(s) ?? decimal(x.toFixed(12))!;
}

export const add = (a: Q, b: Q): Q => ({ n: a.n * b.d + b.n * a.d, d: a.d * b.d });
export const mul = (a: Q, b: Q): Q => ({ n: a.n * b.n, d: a.d * b.d });
/** a / b; b must not be 0. */
export const div = (a: Q, b: Q): Q => (b.n < 0n ? { n: -a.n * b.d, d: a.d * -b.n } : { n: a.n * b.d, d: a.d * b.n });
export const ZERO: Q = { n: 0n, d: 1n };

/** -1, 0 or 1 as a is below, equal to or above b. */
export function cmp(a: Q, b: Q): number {
  const l = a.n * b.d;
  const r = b.n * a.d;
  return l < r ? -1 : l > r ? 1 : 0;
}

export const toNumber = (q: Q): number => Number(q.n) / Number(q.d);
export const isInteger = (q: Q): boolean => q.n % q.d === 0n;
