// Scores pronunciation estimators against the CMU Pronouncing Dictionary on one list of words.
// An estimate counts as right when it matches any listed pronunciation of the word (the
// dictionary lists several for many words), and the phone error rate takes the nearest listed
// one. Used by `npm run bench` and the estimator's unit test, so both report the same figures.
import { wordComplexity } from '../../server/src/core/wcm';

export interface Scores {
  words: number;
  /** Shares 0-1; null where the system gives no such output (a syllable counter has no phones). */
  phonesExact: number | null;
  phonesExactStress: number | null;
  /** Phone error rate: edits (stress ignored) over reference phones, 0-1. */
  per: number | null;
  syllablesExact: number;
  stressExact: number | null;
  wcmExact: number | null;
}

/** What a system says about a word: its phones, or only a syllable count. */
export type System = (word: string) => { phones: string[] } | { syllables: number };

const bare = (p: string): string => p.replace(/\d$/, '');
const vowel = (p: string): boolean => /\d$/.test(p);
const syllables = (phones: string[]): number => phones.filter(vowel).length;
/** 0-based index of the vowel with primary stress, -1 when none. */
export function primaryStress(phones: string[]): number {
  return phones.filter(vowel).findIndex((p) => p.endsWith('1'));
}

function editDistance(a: string[], b: string[]): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) {
      cur[j] = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
    prev = cur;
  }
  return prev[b.length];
}

export function score(words: Map<string, string[][]>, system: System): Scores {
  let n = 0;
  let phones = 0;
  let phonesStress = 0;
  let edits = 0;
  let refPhones = 0;
  let syl = 0;
  let stress = 0;
  let wcm = 0;
  let hasPhones = false;
  const wcmOf = (p: string[]): number => wordComplexity(p).total;
  for (const [word, refs] of words) {
    n++;
    const out = system(word);
    if ('syllables' in out) {
      if (refs.some((r) => syllables(r) === out.syllables)) syl++;
      continue;
    }
    hasPhones = true;
    const got = out.phones;
    const gotBare = got.map(bare).join(' ');
    if (refs.some((r) => r.map(bare).join(' ') === gotBare)) phones++;
    if (refs.some((r) => r.join(' ') === got.join(' '))) phonesStress++;
    let best = Infinity;
    let bestLen = 0;
    for (const r of refs) {
      const d = editDistance(r.map(bare), got.map(bare));
      if (d < best) [best, bestLen] = [d, r.length];
    }
    edits += best;
    refPhones += bestLen;
    if (refs.some((r) => syllables(r) === syllables(got))) syl++;
    if (refs.some((r) => primaryStress(r) === primaryStress(got))) stress++;
    const w = wcmOf(got);
    if (refs.some((r) => wcmOf(r) === w)) wcm++;
  }
  const share = (k: number): number | null => (hasPhones ? k / n : null);
  return {
    words: n,
    phonesExact: share(phones),
    phonesExactStress: share(phonesStress),
    per: hasPhones ? edits / refPhones : null,
    syllablesExact: syl / n,
    stressExact: share(stress),
    wcmExact: share(wcm),
  };
}
