// The syllable vote of the estimator: a minimum-Bayes-risk choice of the syllable count over
// an n-best list (Kumar & Byrne 2004, HLT-NAACL, minimum-Bayes-risk decoding, from memory; on
// the n-best lists of joint-sequence models, Bisani & Ney 2008, Speech Communication 50(5)).
// The expected values are computed by hand from the scores given.
import { describe, expect, it } from 'vitest';
import { syllableVote, vowelCount } from '../../server/src/core/g2p/syllableVote';

const p = (phones: string, log10: number) => ({ phones: phones.split(' '), log10 });

describe('vowelCount', () => {
  it('counts the phones that carry a stress digit (CMU vowels, common practice)', () => {
    expect(vowelCount('K AE1 T'.split(' '))).toBe(1);
    expect(vowelCount('B AH0 N AE1 N AH0'.split(' '))).toBe(3);
    expect(vowelCount('B ER1 D ER0'.split(' '))).toBe(2);
    expect(vowelCount([])).toBe(0);
  });
});

describe('syllableVote', () => {
  it('keeps the first proposal when its count has the most mass', () => {
    // Masses at temperature 1 (computed): 3 vowels 10^0 = 1; 2 vowels 10^-0.2 = 0.63.
    const list = [p('B AH0 N AE1 N AH0', -1.0), p('B N AE1 N AH0', -1.2)];
    expect(syllableVote(list, 1)).toBe(0);
  });

  it('moves to the count that two lower proposals share when together they outweigh the first', () => {
    // 3 vowels: 1; 2 vowels: 10^-0.2 + 10^-0.25 = 0.631 + 0.562 = 1.19 (computed): the best
    // proposal with 2 vowels is the second.
    const list = [p('HH EH1 N AH0 L IY0', -1.0), p('HH EH1 N L IY0', -1.2), p('HH EH1 N L EY0', -1.25)];
    expect(syllableVote(list, 1)).toBe(1);
  });

  it('flattens the scores by the temperature', () => {
    // 1 vowel at -1 against two 2-vowel proposals at -2 each (computed): temperature 1 gives
    // 1 against 0.2, 3 gives 1 against 2 x 10^(-1/3) = 0.93, 4 gives 1 against 2 x 10^-0.25 = 1.12.
    const list = [p('D AA1 L', -1), p('D AA1 AH0 L', -2), p('D AA1 L IY0', -2)];
    expect(syllableVote(list, 1)).toBe(0);
    expect(syllableVote(list, 3)).toBe(0);
    expect(syllableVote(list, 4)).toBe(1);
  });

  it('keeps the first count on a tie, and reads the scores in any order', () => {
    // Equal masses (1 and 1, computed): the first proposal's count stays.
    expect(syllableVote([p('K AE1 T', -2), p('K AE1 T AH0', -2)], 1)).toBe(0);
    // The first proposal need not have the highest score (the estimator ranks well-formed stress first).
    const list = [p('K AE1 T', -3), p('K AE1 T AH0', -1), p('K AE0 T AH1', -1.5)];
    expect(syllableVote(list, 1)).toBe(1);
  });

  it('never chooses no vowels while some proposal has one (8 of 135,155 CMU entries have none)', () => {
    // The count the CMU Pronouncing Dictionary (npm cmu-pronouncing-dictionary@3.0.0) gives
    // "shed": SH EH1 D. 0 vowels hold mass 1 + 10^-0.5 = 1.32 against 1 vowel's 10^-1 = 0.1
    // (computed), yet the best proposal with a vowel is chosen.
    const list = [p('SH T', -1), p('SH D', -1.5), p('SH EH1 D', -2)];
    expect(syllableVote(list, 1)).toBe(2);
    // Among the counts left, mass still decides: 2 vowels 10^-0.1 = 0.79 against 1 vowel 10^-1.
    expect(syllableVote([...list, p('SH EH1 D IY0', -1.1)], 1)).toBe(3);
    // When no proposal has a vowel ("hmm" = HH M in the dictionary), the first stays.
    expect(syllableVote([p('HH M', -1), p('M', -2)], 1)).toBe(0);
  });

  it('returns -1 for an empty list', () => {
    expect(syllableVote([], 3)).toBe(-1);
  });
});
