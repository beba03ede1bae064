// ARPAbet as the CMU Pronouncing Dictionary uses it: 39 phones, vowels carry a stress digit
// (0 none, 1 primary, 2 secondary). Phone classes and the IPA table are data, not logic.

export const VOWELS = new Set([
  'AA', 'AE', 'AH', 'AO', 'AW', 'AY', 'EH', 'ER', 'EY', 'IH', 'IY', 'OW', 'OY', 'UH', 'UW',
]);

export const CONSONANTS = new Set([
  'B', 'CH', 'D', 'DH', 'F', 'G', 'HH', 'JH', 'K', 'L', 'M', 'N', 'NG', 'P', 'R', 'S', 'SH', 'T',
  'TH', 'V', 'W', 'Y', 'Z', 'ZH',
]);

/** IPA for each phone (the usual General American values, from memory); unstressed AH and ER have their own symbols. */
export const IPA: Readonly<Record<string, string>> = {
  AA: 'ɑ', AE: 'æ', AH: 'ʌ', AH0: 'ə', AO: 'ɔ', AW: 'aʊ', AY: 'aɪ', EH: 'ɛ', ER: 'ɝ', ER0: 'ɚ',
  EY: 'eɪ', IH: 'ɪ', IY: 'i', OW: 'oʊ', OY: 'ɔɪ', UH: 'ʊ', UW: 'u',
  B: 'b', CH: 'tʃ', D: 'd', DH: 'ð', F: 'f', G: 'ɡ', HH: 'h', JH: 'dʒ', K: 'k', L: 'l', M: 'm',
  N: 'n', NG: 'ŋ', P: 'p', R: 'ɹ', S: 's', SH: 'ʃ', T: 't', TH: 'θ', V: 'v', W: 'w', Y: 'j',
  Z: 'z', ZH: 'ʒ',
};

/** Phone without its stress digit. */
export function base(phone: string): string {
  const last = phone.charCodeAt(phone.length - 1);
  return last >= 48 && last <= 57 ? phone.slice(0, -1) : phone;
}

export function isVowel(phone: string): boolean {
  return VOWELS.has(base(phone));
}

/** Stress digit of a vowel phone (0, 1, 2), or -1 for consonants. */
export function stressOf(phone: string): number {
  const last = phone.charCodeAt(phone.length - 1);
  return last >= 48 && last <= 50 ? last - 48 : -1;
}

export function parsePhones(text: string): string[] {
  const t = text.trim();
  return t ? t.split(/\s+/) : [];
}

export interface BadPhone {
  phone: string;
  index: number;
  reason: string;
}

/** Checks written phones: known ARPAbet, vowels with a stress digit 0-2, consonants without. */
export function validatePhones(phones: string[]): BadPhone[] {
  const bad: BadPhone[] = [];
  phones.forEach((raw, index) => {
    const phone = raw.toUpperCase();
    const m = /^([A-Z]+)([0-9]?)$/.exec(phone);
    const name = m?.[1] ?? '';
    const digit = m?.[2] ?? '';
    if (!m || (!VOWELS.has(name) && !CONSONANTS.has(name))) {
      bad.push({ phone: raw, index, reason: 'use one of the 39 phones, e.g. AE1, K, NG' });
    } else if (VOWELS.has(name) && digit === '') {
      bad.push({ phone: raw, index, reason: `a vowel needs a stress digit (${name}0, ${name}1 or ${name}2)` });
    } else if (VOWELS.has(name) && !/[012]/.test(digit)) {
      bad.push({ phone: raw, index, reason: 'stress digits are 0, 1 or 2' });
    } else if (CONSONANTS.has(name) && digit !== '') {
      bad.push({ phone: raw, index, reason: 'consonants carry no stress digit' });
    }
  });
  return bad;
}

/**
 * English onsets allowed at the start of a syllable, for maximal-onset syllabification
 * (two- and three-consonant onsets of General American; from memory of standard phonotactics).
 */
const ONSETS = new Set([
  'P R', 'P L', 'B R', 'B L', 'T R', 'D R', 'K R', 'K L', 'G R', 'G L', 'F R', 'F L', 'TH R',
  'SH R', 'S P', 'S T', 'S K', 'S M', 'S N', 'S L', 'S W', 'S F', 'T W', 'D W', 'K W', 'G W',
  'TH W', 'P Y', 'B Y', 'K Y', 'G Y', 'F Y', 'V Y', 'M Y', 'HH Y', 'S P R', 'S P L', 'S T R',
  'S K R', 'S K W', 'S K L', 'S P Y', 'S K Y',
]);

/**
 * Splits phones into syllables by the maximal-onset principle: between two vowels, the longest
 * run of consonants that can start an English syllable goes to the second. Returns the index of
 * the first phone of each syllable.
 */
export function syllableStarts(phones: string[]): number[] {
  const vowels: number[] = [];
  phones.forEach((p, i) => {
    if (isVowel(p)) vowels.push(i);
  });
  if (vowels.length === 0) return phones.length ? [0] : [];
  const starts = [0];
  for (let v = 1; v < vowels.length; v++) {
    const prev = vowels[v - 1];
    const cur = vowels[v];
    let onset = cur;
    // Grow the onset leftwards while it stays a legal onset (single consonants always are, except NG).
    for (let s = cur - 1; s > prev; s--) {
      const cand = phones.slice(s, cur).join(' ');
      const single = cur - s === 1;
      if ((single && phones[s] !== 'NG') || ONSETS.has(cand)) onset = s;
      else break;
    }
    starts.push(onset);
  }
  return starts;
}

/** The IPA form of a pronunciation, with stress marks before stressed syllables (ˈ primary, ˌ secondary). */
export function toIpa(phones: string[]): string {
  const starts = new Set(syllableStarts(phones));
  const syllableStress = new Map<number, number>();
  let currentStart = 0;
  phones.forEach((p, i) => {
    if (starts.has(i)) currentStart = i;
    const s = stressOf(p);
    if (s > 0) syllableStress.set(currentStart, s);
  });
  const multi = starts.size > 1;
  let out = '';
  phones.forEach((p, i) => {
    if (multi && starts.has(i)) {
      const s = syllableStress.get(i);
      if (s === 1) out += 'ˈ';
      else if (s === 2) out += 'ˌ';
    }
    const b = base(p);
    out += (stressOf(p) === 0 ? IPA[`${b}0`] : undefined) ?? IPA[b] ?? p;
  });
  return out;
}
