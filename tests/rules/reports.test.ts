// What single rules report, word for word, where the fixture snapshots would let a change slip by:
// quick-fix-only fixes, the Unnecessary tag, facts-only pace messages, words with no estimate,
// items with nothing to say and overrides no item uses.
import { describe, expect, it } from 'vitest';
import { estimatePronunciation } from '../../server/src/core/lts/estimate';
import { words } from '../helpers/data';
import { lintText } from './check';

const only = (text: string, rule: string) => lintText(text).filter((p) => p.rule === rule);

describe('duplicate-item', () => {
  it('marks the repeat unnecessary and offers its removal as a quick fix only', () => {
    const [p] = only('== One\nCome in.\nSit down.\nCome in!\n', 'duplicate-item');
    expect(p).toMatchObject({ line: 3, unnecessary: true, fix: { batch: false } });
  });
});

describe('duplicate-item keys', () => {
  it('ignore the accents of Latin letters, as lookups do, and keep those of other scripts', () => {
    // "Café" is spoken "cafe" (the dictionary's spelling); Greek accents mark stress and stay.
    const text = '== One\nCafé au lait.\ncafe au lait\nCAFE\u0301 AU LAIT!\nΚαλημέρα.\nκαλημερα\n';
    expect(only(text, 'duplicate-item').map((p) => [p.line, p.related![0].line])).toEqual([
      [2, 1],
      [3, 1],
    ]);
  });
});

describe('estimated-word', () => {
  it('offers the estimate as a quick fix only', () => {
    const [p] = only('== One\nTeodric is here.\n', 'estimated-word');
    const estimate = estimatePronunciation('teodric', words);
    expect(estimate.how).toBe('joint-sequence model');
    expect(p.message).toContain('estimated from its spelling');
    expect(p.fix).toMatchObject({ batch: false, edits: [{ line: 0, character: 0, newText: `@say Teodric = ${estimate.phones.join(' ')}\n` }] });
  });

  it('writes an accented name as the script does, and the @say line it offers then applies', () => {
    const text = '== One\nAnaïs came home.\n';
    const [p] = only(text, 'estimated-word');
    // Looked up and estimated with its diaeresis (core/hiatus.ts): the vowels said apart.
    const phones = estimatePronunciation('anaïs', words).phones.join(' ');
    expect(p.fix!.edits[0].newText).toBe(`@say Anaïs = ${phones}\n`);
    // Applied, the line is an override of the word (nothing estimated, nothing unused).
    const fixed = `${p.fix!.edits[0].newText}${text}`;
    expect(lintText(fixed).filter((q) => q.rule === 'estimated-word' || q.rule === 'unused-override')).toEqual([]);
  });

  it('says plainly when no letter-to-sound rule applies, with no fix', () => {
    const ps = only('== One\nΚαλημέρα Irene.\n', 'estimated-word');
    expect(ps.map((p) => [p.character, p.endCharacter, p.message, p.fix])).toEqual([
      [0, 8, 'no English letter-to-sound rule applies to "Καλημέρα"; add a pronunciation with @say Καλημέρα = PHONES', undefined],
    ]);
  });
});

describe('pace-below-baseline', () => {
  it('states the pace, the baseline and their ratio, at info level, and nothing more', () => {
    // 0.6 / 0.8 = 0.75.
    const ps = only('@baseline 0.8 wps\n@paces 0.6, 1.5 wps\n== One\nCome in.\n', 'pace-below-baseline');
    expect(ps.map((p) => `${p.line + 1} ${p.severity} ${p.message}`)).toEqual([
      "2 info pace 0.6 wps is below the client's baseline of 0.8 wps (ratio 0.75)",
    ]);
  });
});

describe('silent-item', () => {
  it('reports an item with no words to say, and not one whose digits are words', () => {
    const ps = only('== One\n...\n!!! ???\n3!\nCome in.\n', 'silent-item');
    expect(ps.map((p) => `${p.line + 1}:${p.character + 1}-${p.endCharacter + 1} ${p.severity} ${p.message}`)).toEqual([
      '2:1-4 warning this item has no words to say (0 words)',
      '3:1-8 warning this item has no words to say (0 words)',
    ]);
  });
});

describe('unused-override', () => {
  const TEXT = [
    '@say mother-in-law = M AH1 DH ER0 IH0 N L AO2',
    '@say Dr. = D AA1 K T ER0',
    '@say Okafor = OW0 K AA1 F AO0 R',
    '@say doctor = D AA1 K T ER0',
    '== One',
    'My mother-in-law met Dr. Brown.',
  ].join('\n');

  it('names the word and, for a hyphen or a full stop, why it never matches', () => {
    expect(only(TEXT, 'unused-override').map((p) => `${p.line + 1}:${p.character + 1}-${p.endCharacter + 1} ${p.unnecessary} ${p.message}`)).toEqual([
      '1:6-19 true "mother-in-law" is never spoken as a word in any item, so this @say line is not used: items are looked up word by word, and a hyphenated word is looked up as its parts',
      '2:6-9 true "Dr." is never spoken as a word in any item, so this @say line is not used: items are looked up word by word, and a full stop is never part of a spoken word (abbreviations are expanded)',
      '3:6-12 true "Okafor" is never spoken as a word in any item, so this @say line is not used',
    ]);
  });

  it('marks the word as written, accents and all (Zoe\u0308 is four UTF-16 units, its key "zoe" three)', () => {
    const text = '@say Zoe\u0308 = Z OW1 IY0\n@say Renée = R AH0 N EY1\n== One\nZoë came.\n';
    expect(only(text, 'unused-override').map((p) => [p.line, p.character, p.endCharacter, p.message])).toEqual([
      [1, 5, 10, '"Renée" is never spoken as a word in any item, so this @say line is not used'],
    ]);
    expect(only('@say Zoe\u0308 = Z OW1 IY0\n== One\nNobody came.\n', 'unused-override').map((p) => [p.character, p.endCharacter])).toEqual([[5, 9]]);
  });

  it('says why a number never matches: it is spoken as words', () => {
    expect(only('@say 3 = TH R IY1\n@say three = TH R IY1\n== One\nWe have 3 cats.\n', 'unused-override').map((p) => p.message)).toEqual([
      '"3" is never spoken as a word in any item, so this @say line is not used: items are looked up word by word, and digits are spoken as words ("3" is "three")',
    ]);
  });

  it('is silent once every override is spoken', () => {
    expect(only('@say law = L AO1\n@say read = 2\n== One\nMy mother-in-law will read it.\n', 'unused-override')).toEqual([]);
  });
});

describe('bad-variant', () => {
  // Listed counts from the CMU Pronouncing Dictionary (npm cmu-pronouncing-dictionary@3.0.0).
  const listed = (w: string) => words.pronunciations(w)?.length ?? 0;

  it('names the word as written, not its lookup form, in items and on @say lines', () => {
    expect(listed('read')).toBe(2);
    const cafe = listed('cafe');
    expect(cafe).toBeGreaterThan(0);
    const text = `@say READ = 5\n== One\nRead(3) it.\nA Café(${cafe + 1}) and a well-read(4) book.\n`;
    const s = (n: number) => (n === 1 ? '' : 's');
    expect(only(text, 'bad-variant').map((p) => [p.line, p.character, p.endCharacter, p.message])).toEqual([
      [0, 5, 9, '"READ" has 2 listed pronunciations, not 5; the first is used'],
      [2, 0, 7, '"Read" has 2 listed pronunciations, not 3; the first is used'],
      [3, 2, 9, `"Café" has ${cafe} listed pronunciation${s(cafe)}, not ${cafe + 1}; the first is used`],
      // A mark after a hyphenated token chooses for its last word.
      [3, 16, 28, '"read" has 2 listed pronunciations, not 4; the first is used'],
    ]);
  });

  it('says an unlisted word is estimated, not that a first listed one is used', () => {
    expect(listed('zorblatt')).toBe(0);
    expect(only('== One\nZorblatt(2) came.\n', 'bad-variant').map((p) => p.message)).toEqual([
      '"Zorblatt" is not in the dictionary, so there is no listed pronunciation 2 to choose; it is estimated',
    ]);
  });
});
