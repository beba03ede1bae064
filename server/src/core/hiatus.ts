// A diaeresis on a vowel letter that follows another vowel letter marks a hiatus: the two vowels
// are said apart, in two syllables (Thaïs, Gaël, Anaïs, naïve, Noël, Zoë, coöperate). Word
// lookup forms keep that one mark (core/tokenize.ts lookupForm) and drop every other accent of a
// Latin letter, so "Thaïs" is not read as the dictionary's "thais" (T AY1 Z, people of Thailand).
// Dictionary and frequency lookups use the plain spelling; a listed pronunciation is taken only
// when it says the two vowels apart, and an estimate is made with them apart (core/pronounce.ts,
// core/g2p/decode.ts). Pure.

/** The marked vowels a lookup form keeps, and their plain letters. */
const PLAIN: Readonly<Record<string, string>> = { 'ä': 'a', 'ë': 'e', 'ï': 'i', 'ö': 'o', 'ü': 'u', 'ÿ': 'y' };
const VOWEL_LETTER = /[aeiouy]/i;
/** U+0308 COMBINING DIAERESIS. */
const DIAERESIS = '\u0308';

/**
 * A Latin word taken apart into base letters and marks (NFD) without its marks, except a
 * diaeresis on a vowel letter right after another vowel letter (marks of the earlier letter do
 * not count). The caller composes (NFC) and lower-cases.
 */
export function keepHiatusMarks(nfd: string): string {
  let out = '';
  let prevBase = '';
  let base = '';
  for (const ch of nfd) {
    if (/\p{M}/u.test(ch)) {
      if (ch === DIAERESIS && VOWEL_LETTER.test(base) && VOWEL_LETTER.test(prevBase)) out += ch;
      continue;
    }
    prevBase = base;
    base = ch;
    out += ch;
  }
  return out;
}

export interface Hiatus {
  /** The spelling without the marks, as the dictionary spells it ("thais"). */
  plain: string;
  /** Index in `plain` of each marked vowel: a hiatus lies just before it. */
  at: number[];
}

/** The hiatus marks of a lookup form, or null when it has none (any plain ASCII word). */
export function hiatusOf(spoken: string): Hiatus | null {
  // Nearly every word is ASCII: look before building anything.
  let first = -1;
  for (let i = 0; i < spoken.length && first < 0; i++) if (spoken.charCodeAt(i) >= 0x80 && PLAIN[spoken[i]] !== undefined) first = i;
  if (first < 0) return null;
  const at: number[] = [];
  let plain = spoken.slice(0, first);
  for (let i = first; i < spoken.length; i++) {
    const p = spoken.charCodeAt(i) >= 0x80 ? PLAIN[spoken[i]] : undefined;
    if (p !== undefined) at.push(i);
    plain += p ?? spoken[i];
  }
  return { plain, at };
}

/** The spelling the dictionary and the frequency list know a lookup form by. */
export function plainSpelling(spoken: string): string {
  return hiatusOf(spoken)?.plain ?? spoken;
}
