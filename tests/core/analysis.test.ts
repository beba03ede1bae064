// Per-item analysis: durations, rates, composite difficulty and the script format.
import { describe, expect, it } from 'vitest';
import { composite, difficultyComponents } from '../../server/src/core/difficulty';
import { makePace, parsePaces, timeAt, READING_NORM_WPS } from '../../server/src/core/pace';
import { analyzeText } from '../helpers/data';
import { lint, renderFindings } from '../../server/src/rules/index';

describe('projected durations', () => {
  it('word pacing vs syllable pacing (computed from cmu-pronouncing-dictionary@3.0.0)', () => {
    // "My granddaughter visits every Sunday afternoon." is 6 words and 14 syllables:
    // 2.40 s at 2.5 words/s, 3.50 s at 4 syllables/s.
    const a = analyzeText('@paces 2.5 wps, 4 sps\nMy granddaughter visits every Sunday afternoon.\n');
    const it0 = a.items[0];
    expect(it0.wordCount).toBe(6);
    expect(it0.syllables).toBe(14);
    expect(it0.timings[0].seconds).toBeCloseTo(2.4, 10);
    expect(it0.timings[1].seconds).toBeCloseTo(3.5, 10);
    // Implied syllable rate at the word pace: 14 / 2.4 s.
    expect(it0.timings[0].syllableRate).toBeCloseTo(14 / 2.4, 10);
  });

  it('reading-aloud norm is 183 words/min = 3.05 words/s (Brysbaert 2019)', () => {
    expect(READING_NORM_WPS).toBeCloseTo(3.05, 2);
    expect(timeAt(makePace(3.2, 'wps'), 4, 5, null).aboveReadingNorm).toBe(true);
    expect(timeAt(makePace(2, 'wps'), 4, 5, null).aboveReadingNorm).toBe(false);
  });

  it('ratio to baseline: 20 % faster than the unassisted rate is 1.2 (common practice)', () => {
    const t = timeAt(makePace(0.96, 'wps'), 4, 5, 0.8);
    expect(t.baselineRatio).toBeCloseTo(1.2, 10);
  });

  it('reads pace lists with units', () => {
    expect(parsePaces('1, 1.5 wps, 4 sps').paces.map((p) => p.label)).toEqual(['1 wps', '1.5 wps', '4 sps']);
    expect(parsePaces('2').paces.map((p) => p.label)).toEqual(['2 wps']);
    expect(parsePaces('fast').error).toMatch(/cannot read "fast"/);
    expect(parsePaces('2 wpm').error).toMatch(/per second, not per minute/);
  });
});

describe('composite difficulty (README: length, complexity, rarity; project convention)', () => {
  it('scales each component to 0-1 and weights them', () => {
    const c = difficultyComponents({ syllables: 20, words: 10, wcm: 60, zipfMean: 1.2918, zipfMin: 1.2918 });
    expect(c).toEqual({ length: 1, complexity: 1, rarity: 1 });
    expect(composite(c, { length: 0.4, complexity: 0.4, rarity: 0.2 })).toBe(100);
    const easy = difficultyComponents({ syllables: 1, words: 1, wcm: 0, zipfMean: 7, zipfMin: 7 });
    expect(composite(easy, { length: 0.4, complexity: 0.4, rarity: 0.2 })).toBe(0);
  });

  it('orders a two-word greeting below a long sentence of rare words', () => {
    const a = analyzeText('Hi there.\nThe orthodontist recommended periodontal treatment.\n');
    expect(a.items[0].difficulty).toBeLessThan(a.items[1].difficulty);
    expect(a.items[0].rank).toBe(1);
    expect(a.items[1].rank).toBe(2);
  });
});

describe('script format', () => {
  it('a file of bare sentences is one implicit rung at default paces', () => {
    const a = analyzeText('Good morning.\nThank you.\n');
    expect(a.rungs).toHaveLength(1);
    expect(a.rungs[0].node.implicit).toBe(true);
    expect(a.rungs[0].paces.map((p) => p.label)).toEqual(['1 wps', '1.5 wps', '2 wps']);
    expect(renderFindings(a.findings)).toEqual([]);
  });

  it('reads rungs, rung paces, notes, ids and sets', () => {
    const a = analyzeText(
      [
        '@paces 1, 2 wps',
        '== One @pace 1.5 @set trained',
        'Pour the milk. | slowly #milk1 @set untrained',
        '== Two',
        '@pace 3 sps',
        'Wash the cup.',
      ].join('\n'),
    );
    expect(a.rungs.map((r) => r.node.name)).toEqual(['One', 'Two']);
    expect(a.rungs[0].paces.map((p) => p.label)).toEqual(['1.5 wps']);
    expect(a.rungs[0].node.sets).toEqual(['trained']);
    expect(a.rungs[1].paces.map((p) => p.label)).toEqual(['3 sps']);
    const item = a.rungs[0].items[0].node;
    expect(item).toMatchObject({ text: 'Pour the milk.', id: 'milk1', note: 'slowly', sets: ['untrained'] });
  });

  it('set labels: an item\'s own, else its rung\'s, else the header\'s', () => {
    const a = analyzeText(['@set trained', '== One', 'Pour the milk.', 'Wash the cup. | @set control', '== Two', '@set untrained', 'Cut the bread.'].join('\n'));
    expect(a.items.map((i) => i.sets)).toEqual([['trained'], ['control'], ['untrained']]);
  });

  it('overrides: phones and a chosen listed variant; bad phones are reported at their column', () => {
    const a = analyzeText('@say Marisol = M EH1 R IH0 S OW2 L\n@say read = 2\n@say Zed = Z EH1 DX\nMarisol will read.\n');
    const w = a.items[0].words;
    expect(w[0]).toMatchObject({ spoken: 'marisol', source: 'override', syllables: 3 });
    expect(w[2].phones.join(' ')).toBe('R IY1 D');
    const bad = renderFindings(a.findings).find((p) => p.rule === 'unknown-phone')!;
    // "@say Zed = Z EH1 DX": DX starts at column 17 (0-based).
    expect(bad).toMatchObject({ line: 2, character: 17, endCharacter: 19 });
  });

  it('an override of an accented word applies wherever it is spoken, accented or not', () => {
    // Items look "José" up as "jose" (the dictionary's spelling, HH OW0 Z EY1 in CMU); the @say
    // line's word is keyed the same way, written precomposed or with a combining accent.
    for (const say of ['José', 'JOSE\u0301', "Jose"]) {
      const a = analyzeText(`@say ${say} = HH OW0 S EY1\nJosé came.\nJOSÉ left.\nJose stayed.\n`);
      for (const it of a.items) expect(it.words[0]).toMatchObject({ spoken: 'jose', source: 'override', phones: ['HH', 'OW0', 'S', 'EY1'] });
      expect(lint(a, '').filter((p) => p.rule === 'unused-override')).toEqual([]);
    }
  });

  it('a name spelt out by an override and unseen in SUBTLEX-US is left out of the rarity figures', () => {
    const a = analyzeText('@say Teodric = T IY1 OW0 D R IH0 K\nThank you, Teodric.\nThank you.\nTeodric.\n');
    const [withName, plain, nameOnly] = a.items;
    expect(withName.words[2]).toMatchObject({ spoken: 'teodric', source: 'override', count: 0 });
    expect(withName.zipfMean).toBeCloseTo(plain.zipfMean, 10);
    expect(withName.zipfMin).toBeCloseTo(plain.zipfMin, 10);
    expect(withName.lowFrequencyWords).toBe(0);
    // An item of nothing but the name keeps it: Zipf of an unseen word, 1.2918 (Laplace floor).
    expect(nameOnly.zipfMin).toBeCloseTo(1.2918, 4);
  });

  it('a word-variant mark chooses one occurrence: record(2)', () => {
    const a = analyzeText('A record(2) of it.\n');
    const rec = a.items[0].words.find((x) => x.spoken === 'record')!;
    expect(rec.phones.join(' ')).toBe('R EH1 K ER0 D');
    expect(rec.variant).toBe(2);
  });

  it('a variant mark after a hyphenated compound chooses for its last part only', () => {
    const a = analyzeText('She is well-read(2).\n');
    const [well, read] = a.items[0].words.slice(2);
    expect(well).toMatchObject({ spoken: 'well', variant: 1 });
    expect(read.phones.join(' ')).toBe('R IY1 D');
    expect(renderFindings(a.findings).filter((p) => p.rule === 'bad-variant')).toEqual([]);
  });

  it('unknown and malformed settings become problems with a nearest-key fix, never a throw', () => {
    const a = analyzeText('@pacse 1 wps\n@baseline fast\nHello.\n');
    const unknown = renderFindings(a.findings).find((p) => p.rule === 'unknown-key')!;
    expect(unknown.message).toContain('did you mean "@paces"');
    expect(unknown.fix!.edits[0]).toMatchObject({ line: 0, character: 0, endCharacter: 6, newText: '@paces' });
    const bad = renderFindings(a.findings).find((p) => p.rule === 'bad-value')!;
    expect(bad).toMatchObject({ line: 1, character: 10 });
  });

  it('never throws on arbitrary input', () => {
    let seed = 42;
    const rand = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
    const alphabet = ['@', '=', '|', '#', '/', ' ', '\n', 'a', 'é', '3', ':', '(', ')', '💬', '\t', '\r', 'paces', 'say', '-'];
    for (let i = 0; i < 300; i++) {
      let s = '';
      for (let j = 0; j < 80; j++) s += alphabet[Math.floor(rand() * alphabet.length)];
      expect(() => analyzeText(s)).not.toThrow();
    }
  });
});
