// Word frequency on the SUBTLEX-US counts (Brysbaert & New 2009, Behavior Research Methods 41(4),
// 977-990): 51 million tokens of US film and TV subtitles. The package's counts sum to 49.7 million,
// but the published per-million and Zipf values use the corpus size, 51 million.

/** Corpus size in millions of tokens (Brysbaert & New 2009). */
export const SUBTLEX_MILLIONS = 51;
/** Word types in SUBTLEX-US, used in the Laplace correction of the Zipf scale. */
export const SUBTLEX_TYPES_MILLIONS = 0.074286;

/**
 * Zipf value (van Heuven, Mandera, Keuleers & Brysbaert 2014, QJEP 67(6), 1176-1190):
 * log10 of frequency per billion words, Laplace-smoothed so unseen words get a value.
 * Range about 1.29 (unseen) to 7.6 ("you"); 1-3 is low frequency, 4-7 high.
 */
export function zipf(count: number): number {
  return Math.log10((count + 1) / (SUBTLEX_MILLIONS + SUBTLEX_TYPES_MILLIONS)) + 3;
}

/** Lg10WF of SUBTLEX-US: log10(count + 1); 0 for unseen words. */
export function lg10wf(count: number): number {
  return Math.log10(count + 1);
}

/** Words below this Zipf value count as low frequency (van Heuven et al. 2014: 1-3 is low). */
export const LOW_FREQUENCY_ZIPF = 3;
