// Plausible ranges of the numeric settings, read by the table of settings (core/settings.ts,
// setOptions.ts, records/settings.ts) as each spec's `range` and checked by its reader; the
// settings table of grammar/README.md states each one.
import { MAX_PACE } from './pace';

/**
 * Plausible bounds of every numeric setting, inclusive (`above`: the minimum itself is excluded).
 * A value outside is a problem, so no setting can make a score infinite or NaN.
 */
export interface NumberRange {
  min: number;
  max: number;
  above?: boolean;
  unit?: string;
}

export const NUMBER_RANGES: Record<string, NumberRange> = {
  // Paces and rates: faster than MAX_PACE per second is no human speech (common practice).
  paces: { min: 0, max: MAX_PACE, above: true, unit: 'per second' },
  baseline: { min: 0, max: MAX_PACE, above: true, unit: 'words per second' },
  'reading-norm': { min: 0, max: MAX_PACE, above: true, unit: 'words per second' },
  // Points of the 0-100 difficulty scale.
  'max-step': { min: 0, max: 100, above: true, unit: 'points' },
  // Counts: far above any real rung or item, low enough to stay exact.
  'min-items': { min: 0, max: 10_000 },
  'max-words': { min: 0, max: 10_000 },
  'max-syllables': { min: 0, max: 10_000 },
  'max-phonemes': { min: 0, max: 10_000 },
  // Relative weights: only their ratios matter.
  weights: { min: 0, max: 100 },
  // Matched sets: an equivalence bound in standard deviations, and a count of items.
  'set-bound': { min: 0, max: 10, above: true, unit: 'standard deviations' },
  'set-min-items': { min: 2, max: 10_000 },
  // Rate records: a ratio of two rates (a tenfold gain is already beyond any plausible benefit),
  // and a count of sessions.
  'benefit-mark': { min: 0, max: 10, above: true },
  'ready-sessions': { min: 1, max: 10_000 },
};

/** Null when `n` is inside the key's range; otherwise the problem's message. */
export function outOfRange(key: string, n: number, what = `@${key}`): string | null {
  const r = NUMBER_RANGES[key];
  if (!r) return null;
  const low = r.above ? n <= r.min : n < r.min;
  if (Number.isFinite(n) && !low && n <= r.max) return null;
  return `${what} must be ${r.above ? 'above' : 'at least'} ${r.min} and at most ${r.max}${r.unit ? ` ${r.unit}` : ''}, not ${Number.isFinite(n) ? n : 'a number that large'}`;
}
