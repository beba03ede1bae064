// Numbers as a reader says them: cardinals, ordinals, decimals, years, money and plurals, on
// top of number-to-words (whose output carries commas and hyphens, split off here).
import { toWords, toWordsOrdinal } from 'number-to-words';
import type { Currency } from './abbreviations';

// number-to-words writes "one thousand, two hundred fifty" and "twenty-one".
const NUMBER_WORD_SEPARATORS = /[\s,-]+/;

export const DIGIT_WORDS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine'];

// number-to-words throws past Number.MAX_SAFE_INTEGER (16 digits); longer strings are read out.
const MAX_WORDED_DIGITS = 15;

export function splitNumberWords(s: string): string[] {
  // Readers of American-style number words say no "and"; drop it should the library ever add one.
  return s.split(NUMBER_WORD_SEPARATORS).filter((w) => w !== '' && w !== 'and');
}

export function digitByDigit(digits: string): string[] {
  return [...digits].map((d) => DIGIT_WORDS[d.charCodeAt(0) - 0x30]);
}

// number-to-words dominates the cost of a number and scripts repeat the same few, so wordings of
// up to four digits (at most 11,110 keys, so memory stays bounded) are memoised.
const CACHE_MAX_DIGITS = 4;
const cardinalCache = new Map<string, readonly string[]>();
const ordinalCache = new Map<string, readonly string[]>();

function memoised(cache: Map<string, readonly string[]>, digits: string, word: (n: number) => string): string[] {
  let words = cache.get(digits);
  if (words === undefined) {
    const readOut = (digits.length > 1 && digits[0] === '0') || digits.length > MAX_WORDED_DIGITS;
    words = readOut ? digitByDigit(digits) : splitNumberWords(word(Number(digits)));
    if (digits.length <= CACHE_MAX_DIGITS) cache.set(digits, words);
  }
  return words.slice(); // Callers extend the list, so each gets its own copy.
}

/** Integer digits (no commas) as words; leading zeros ("007") and huge numbers are read digit by digit. */
export function cardinal(digits: string): string[] {
  return memoised(cardinalCache, digits, toWords);
}

export function ordinal(digits: string): string[] {
  return memoised(ordinalCache, digits, toWordsOrdinal);
}

/** "3.14" -> three point one four; ".5" -> point five (decimals are read digit by digit). */
export function amountWords(digits: string, decimals: string | undefined): string[] {
  const words = digits === '' ? [] : cardinal(digits);
  if (decimals !== undefined) words.push('point', ...digitByDigit(decimals));
  return words;
}

export function isYear(intText: string): boolean {
  if (intText.length !== 4) return false;
  const n = Number(intText);
  return n >= 1100 && n <= 2099;
}

/** 1990 -> nineteen ninety, 1905 -> nineteen oh five, 1900 -> nineteen hundred, 2005 -> two thousand five, 2024 -> twenty twenty four. */
export function yearWords(n: number): string[] {
  if (n >= 2000 && n < 2010) return cardinal(String(n));
  const high = Math.floor(n / 100);
  const low = n % 100;
  const words = cardinal(String(high));
  if (low === 0) words.push('hundred');
  else if (low < 10) words.push('oh', DIGIT_WORDS[low]);
  else words.push(...cardinal(String(low)));
  return words;
}

/** "1990s" -> nineteen nineties, "80s" -> eighties, "6s" -> sixes. */
export function pluralise(words: string[]): string[] {
  const last = words.length - 1;
  const w = words[last];
  words[last] = w.endsWith('y') ? `${w.slice(0, -1)}ies` : w.endsWith('x') ? `${w}es` : `${w}s`;
  return words;
}

export function moneyWords(digits: string, decimals: string | undefined, currency: Currency): string[] {
  if (decimals === undefined || decimals.length !== 2) {
    const single = digits === '1' && decimals === undefined;
    const words = amountWords(digits, decimals);
    if (words.length === 0) words.push('zero');
    words.push(single ? currency.one : currency.many);
    return words;
  }
  // Two decimals are a subunit: "$2.50" is said "two dollars fifty cents", "$0.50" "fifty cents".
  const words: string[] = [];
  if (digits !== '' && Number(digits) !== 0) words.push(...cardinal(digits), digits === '1' ? currency.one : currency.many);
  const cents = Number(decimals);
  if (cents !== 0) words.push(...cardinal(String(cents)), cents === 1 ? currency.subunitOne : currency.subunitMany);
  if (words.length === 0) words.push('zero', currency.many);
  return words;
}
