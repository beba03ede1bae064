// The trained pronunciation estimator (joint-sequence model, Bisani & Ney 2008): the committed
// model matches its training script and parameters, the held-out split is what README states,
// and accuracy on held-out words reaches the published level (about 75 % of words exactly right
// with stress ignored for joint-sequence models on the CMU dictionary; Bisani & Ney 2008,
// Speech Communication 50(5), from memory).
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { brotliDecompressSync } from 'node:zlib';
import { dictionary } from 'cmu-pronouncing-dictionary';
import { describe, expect, it } from 'vitest';
import { decode } from '../../server/src/core/g2p/decode';
import { estimateCandidates, PRIOR_BONUS, rankNote } from '../../server/src/core/g2p/estimator';
import { parseModels } from '../../server/src/core/g2p/model';
import { estimatePronunciation, LETTER_NAMES, SPELLED_HOW, spelledOut } from '../../server/src/core/lts/estimate';
import { letterToSound } from '../../server/src/core/lts/letterToSound';
import { entries, fnv1a, part } from '../../server/scripts/g2p/data.mjs';
import { MODEL_PATH, inputsChecksum } from '../../server/scripts/g2p/model-file.mjs';
import { PARAMS } from '../../server/scripts/g2p/params.mjs';
import { score } from '../bench/pronounceEval';
import { PSEUDOWORDS } from '../bench/pseudowords';
import type { WordData } from '../../server/src/core/types';
import { words } from '../helpers/data';

const [model, reverse] = parseModels(brotliDecompressSync(readFileSync(MODEL_PATH)));
const estimator = { forward: model, reverse };
const best = (w: string) => ({ phones: estimateCandidates(estimator, w, 1)[0]?.phones ?? [] });

describe('the committed model', () => {
  it('was trained by the current training script, parameters and dictionary', () => {
    // A changed script, parameter or dictionary version changes this checksum: retrain with
    // `npm run train:pronounce` and commit the model.
    expect([model.header.direction, reverse.header.direction]).toEqual(['forward', 'reverse']);
    for (const m of [model, reverse]) {
      expect(m.header.params).toEqual(PARAMS);
      expect(m.header.checksum).toBe(inputsChecksum(PARAMS));
    }
  });

  it('is a compact file (at most 5 MB)', () => {
    expect(statSync(MODEL_PATH).size).toBeLessThanOrEqual(5e6);
  });
});

describe('the held-out split', () => {
  it('uses 32-bit FNV-1a (test vectors of the FNV reference, from memory)', () => {
    expect(fnv1a('')).toBe(0x811c9dc5);
    expect(fnv1a('a')).toBe(0xe40c292c);
    expect(fnv1a('foobar')).toBe(0xbf9cf968);
  });

  it('holds out about a tenth of the plain spellings', () => {
    const all = [...entries(dictionary).keys()];
    const held = all.filter((w) => part(w) === 'test').length;
    expect(held / all.length).toBeGreaterThan(0.09);
    expect(held / all.length).toBeLessThan(0.11);
  });
});

describe('accuracy on held-out words', () => {
  // Every third held-out word keeps the test quick; `npm run bench` scores all of them.
  const heldOut = new Map<string, string[][]>();
  let i = 0;
  for (const [w, prons] of entries(dictionary)) if (part(w) === 'test' && i++ % 3 === 0) heldOut.set(w, prons);
  const s = score(heldOut, best);

  it('stays at the level measured when the model was committed, far above the NRL rules', () => {
    // Measured on all held-out words (README): 75.2 % phones exact with stress ignored, 97.0 %
    // syllables exact (the 98 % goal is not yet met). The NRL rules reach 37.6 % and 93.0 % on
    // the same words. These floors, on a third of them, catch a regression of the model or decoder.
    expect(s.words).toBeGreaterThan(4000);
    expect(s.phonesExact!).toBeGreaterThanOrEqual(0.73);
    expect(s.syllablesExact).toBeGreaterThanOrEqual(0.955);
    const rules = score(heldOut, (w) => ({ phones: letterToSound(w) }));
    expect(s.phonesExact!).toBeGreaterThan(rules.phonesExact! + 0.3);
    expect(s.syllablesExact).toBeGreaterThan(rules.syllablesExact);
  });

  it('is what Rungs shows for an unlisted word, with morphology weighed in, at least as good', () => {
    // Each word hidden from the lookup, its stems left (what an unlisted word meets): measured on
    // all held-out words (README) 75.8 % phones exact and 97.2 % syllables exact (97.1 % before
    // initialisms were said letter by letter), where taking every analysis as it is gave 70.8 %
    // and 96.6 %.
    let hidden = '';
    const unlisted: WordData = {
      pronunciations: (w) => (w === hidden ? undefined : words.pronunciations(w)),
      count: (w) => words.count(w),
      estimate: (w, k, prior) => estimateCandidates(estimator, w, k, prior),
    };
    const chain = score(heldOut, (w) => ((hidden = w), { phones: estimatePronunciation(w, unlisted).phones }));
    expect(chain.phonesExact!).toBeGreaterThanOrEqual(s.phonesExact!);
    expect(chain.syllablesExact).toBeGreaterThanOrEqual(s.syllablesExact - 0.001);
    expect(chain.phonesExact!).toBeGreaterThanOrEqual(0.74);
  }, 60_000);

  it('gives the syllable counts set by rule to most invented pseudowords', () => {
    for (const [w] of PSEUDOWORDS) expect(words.pronunciations(w), w).toBeUndefined();
    const pseudo = new Map(PSEUDOWORDS.map(([w, n]) => [w, [Array.from({ length: n }, () => 'AH0')]]));
    expect(score(pseudo, best).syllablesExact).toBeGreaterThanOrEqual(0.9);
  });
});

describe('decoding', () => {
  it('ranks candidates with shares that sum to 1', () => {
    const c = estimateCandidates(estimator, 'okafor', 5);
    expect(c.length).toBe(5);
    expect(c.reduce((t, x) => t + x.share, 0)).toBeCloseTo(1, 6);
    // The first is the syllable vote's choice (syllableVote.test.ts); after it, exactly one
    // primary stress ranks first (common practice: one main stress per word), then by score.
    const primaries = (x: { phones: string[] }) => x.phones.filter((p) => p.endsWith('1')).length;
    expect(primaries(c[0])).toBe(1);
    for (let k = 2; k < c.length; k++) {
      const [a, b] = [primaries(c[k - 1]) === 1, primaries(c[k]) === 1];
      expect(a || !b).toBe(true);
      if (a === b) expect(c[k].log10).toBeLessThanOrEqual(c[k - 1].log10);
    }
    expect(new Set(c.map((x) => x.phones.join(' '))).size).toBe(5);
  });

  it('scores a reading built by morphology with both models, plus its weight', () => {
    // 'winter' + 'moss' (lts/estimate.ts builds it as a compound): its score is the sum of the two
    // models' forced scores of exactly those phones, plus PRIOR_BONUS.
    const prior = 'W IH1 N T ER0 M AO2 S'.split(' ');
    const c = estimateCandidates(estimator, 'wintermoss', 5, prior).find((x) => x.phones.join(' ') === prior.join(' '));
    const forced = decode(model, 'wintermoss', 1, 16, prior, true)[0].log10 + decode(reverse, 'ssomretniw', 1, 16, [...prior].reverse(), true)[0].log10;
    expect(c?.log10).toBeCloseTo(forced + PRIOR_BONUS, 9);
    // A reading the models cannot spell at all is left out, never given a score.
    expect(estimateCandidates(estimator, 'wintermoss', 5, ['ZH']).some((x) => x.phones.join(' ') === 'ZH')).toBe(false);
  });

  it('notes readings without exactly one main stress, which rank after those with one', () => {
    expect(rankNote('K AE1 T'.split(' '))).toBe('');
    expect(rankNote('W IH1 N T ER0 M AO1 S'.split(' '))).toBe('2 main stresses: ranked after readings with one');
    expect(rankNote('K AE0 T'.split(' '))).toBe('no main stress: ranked after readings with one');
  });

  it('gives the same first answer whether one or five are asked for', () => {
    for (const w of ['okafor', 'teodric', 'henle', 'zimbabwean']) {
      expect(estimateCandidates(estimator, w, 1)[0].phones).toEqual(estimateCandidates(estimator, w, 5)[0].phones);
    }
  });

  it('emits only CMU phones, stress digits on vowels only', () => {
    const cmu = /^(AA|AE|AH|AO|AW|AY|EH|ER|EY|IH|IY|OW|OY|UH|UW)[012]$|^(B|CH|D|DH|F|G|HH|JH|K|L|M|N|NG|P|R|S|SH|T|TH|V|W|Y|Z|ZH)$/;
    for (const m of [model, reverse]) for (const g of m.graphones.slice(1)) for (const p of g!.phones) expect(p).toMatch(cmu);
  });

  it('leaves a run of letters far longer than any word to the rules', () => {
    expect(estimateCandidates(estimator, 'x'.repeat(50_000), 5)).toEqual([]);
    expect(estimatePronunciation('x'.repeat(50_000), words).how).toBe('letter-to-sound rules');
  });

  it('returns nothing for letters the model never saw', () => {
    expect(estimateCandidates(estimator, 'ωμέγα', 5)).toEqual([]);
    expect(decode(model, '', 5)).toEqual([]);
  });
});

describe('the fallback order', () => {
  // Words and stems below: CMU 0.7b via npm cmu-pronouncing-dictionary@3.0.0.
  it('takes a plural of a listed stem as it is', () => {
    expect(words.pronunciations('marlowes')).toBeUndefined();
    const e = estimatePronunciation('marlowes', words);
    expect(e).toEqual({ phones: [...words.pronunciations('marlowe')![0].split(' '), 'Z'], source: 'morphology', how: "stem 'marlowe' + -s", alternatives: [] });
  });

  it('weighs any other analysis with the estimator and keeps it when it comes first', () => {
    expect(words.pronunciations('unkindnesses')).toBeUndefined();
    const e = estimatePronunciation('unkindnesses', words);
    expect(e.source).toBe('morphology');
    expect(e.how).toBe("stem 'unkind' + -ness + -es");
    expect(e.alternatives[0].phones).toEqual(e.phones);
    expect(e.alternatives.length).toBeGreaterThan(1);
  });

  it("lets the estimator's reading win over a compound the models find less likely, and lists the compound", () => {
    // 'winter' + 'moss' would end in M AO2 S; the models read the unstressed ending as M AH0 S.
    expect(words.pronunciations('wintermoss')).toBeUndefined();
    const compound = [...words.pronunciations('winter')![0].split(' '), 'M', 'AO2', 'S'];
    const e = estimatePronunciation('wintermoss', words);
    expect(e.source).toBe('estimate');
    expect(e.alternatives.map((c) => c.phones)).toContainEqual(compound);
    expect(e.phones).not.toEqual(compound);
  });

  it('says an unlisted spelling with no vowel letter letter by letter, as the dictionary does', () => {
    // The letter names are the CMU Pronouncing Dictionary's own first entries for the letters.
    for (const [c, phones] of Object.entries(LETTER_NAMES)) expect(phones.join(' '), c).toBe(dictionary[c]);
    expect(Object.keys(LETTER_NAMES).sort().join('')).toBe('bcdfghjklmnpqrstvwxz');
    // Unlisted initialisms: NHS, GP, SLT; a possessive takes Z (the dictionary's mj's, nbc's).
    for (const [w, phones] of [['nhs', 'EH1 N EY1 CH EH1 S'], ['gp', 'JH IY1 P IY1'], ['slt', "EH1 S EH1 L T IY1"], ["gp's", 'JH IY1 P IY1 Z']]) {
      expect(words.pronunciations(w), w).toBeUndefined();
      expect(estimatePronunciation(w, words), w).toMatchObject({ phones: phones.split(' '), source: 'estimate', how: SPELLED_HOW, alternatives: [] });
    }
    // A y is a vowel letter here; one letter alone is not an initialism.
    expect(spelledOut('xyz')).toBeUndefined();
    expect(spelledOut('b')).toBeUndefined();
    // The held-out words of this shape (FNV split): letter names give 14 of 15 syllable counts
    // right, the estimator alone 3 (measured when the rule was added).
    let n = 0;
    let right = 0;
    for (const [w, prons] of entries(dictionary)) {
      const phones = part(w) === 'test' ? spelledOut(w) : undefined;
      if (!phones) continue;
      n++;
      const v = (p: readonly string[]) => p.filter((x) => /\d$/.test(x)).length;
      if (prons.some((p) => v(p) === v(phones))) right++;
    }
    expect([n, right]).toEqual([15, 14]);
  });

  it('an unlisted name goes to the estimator, with ranked alternatives', () => {
    expect(words.pronunciations('teodric')).toBeUndefined();
    const e = estimatePronunciation('teodric', words);
    expect(e.source).toBe('estimate');
    expect(e.how).toBe('joint-sequence model');
    expect(e.alternatives[0].phones).toEqual(e.phones);
  });
});
