// The composite difficulty of an item, 0 (easiest) to 100, from three components each scaled to
// 0-1 and combined with configurable weights (default length 0.5, complexity 0.3, rarity 0.2):
//   length     = (syllables - 1) / 15, clamped: 1 syllable -> 0, 16 or more -> 1
//   complexity = mean Word Complexity Measure per word / 6, clamped: a sentence of words as hard
//                as "treasure" or "computer" (WCM 5-6) scores near 1; per-word so it does not
//                double-count length
//   rarity     = half the mean and half the minimum Zipf, each as (7 - Zipf) / (7 - 1.29),
//                clamped: common words (Zipf 7) -> 0, unseen words (Zipf 1.29) -> 1
// The scale is a project convention for ordering items, not a published or validated measure.
import type { DifficultyWeights } from './types';

export const DEFAULT_WEIGHTS: DifficultyWeights = { length: 0.5, complexity: 0.3, rarity: 0.2 };

export const LENGTH_FULL_SYLLABLES = 16;
export const COMPLEXITY_FULL_WCM_PER_WORD = 6;
export const ZIPF_COMMON = 7;
export const ZIPF_UNSEEN = 1.2918;

function clamp01(x: number): number {
  return x < 0 ? 0 : x > 1 ? 1 : x;
}

export interface DifficultyInput {
  syllables: number;
  words: number;
  wcm: number;
  zipfMean: number;
  zipfMin: number;
}

export function difficultyComponents(d: DifficultyInput): { length: number; complexity: number; rarity: number } {
  const length = clamp01((d.syllables - 1) / (LENGTH_FULL_SYLLABLES - 1));
  const complexity = d.words > 0 ? clamp01(d.wcm / d.words / COMPLEXITY_FULL_WCM_PER_WORD) : 0;
  const rare = (z: number) => clamp01((ZIPF_COMMON - z) / (ZIPF_COMMON - ZIPF_UNSEEN));
  const rarity = d.words > 0 ? 0.5 * rare(d.zipfMean) + 0.5 * rare(d.zipfMin) : 0;
  return { length, complexity, rarity };
}

/** Weighted composite on 0-100, rounded to one decimal. Weights need not sum to 1. */
export function composite(
  c: { length: number; complexity: number; rarity: number },
  w: DifficultyWeights,
): number {
  const sum = w.length + w.complexity + w.rarity;
  if (!(sum > 0)) return 0;
  const v = (100 * (w.length * c.length + w.complexity * c.complexity + w.rarity * c.rarity)) / sum;
  return Math.round(v * 10) / 10;
}

/** Median of a list (0 for an empty list). */
export function median(values: ArrayLike<number>): number {
  if (values.length === 0) return 0;
  // A typed array sorts numerically without a comparator call per pair: several times faster on
  // the rung sizes of a large library.
  return medianOfSorted(Float64Array.from(values).sort());
}

/** Median of a list already sorted in ascending order (0 for an empty list). */
export function medianOfSorted(s: ArrayLike<number>): number {
  if (s.length === 0) return 0;
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}
