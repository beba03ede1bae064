// Splits one item of script text into written tokens and the words a reader says for each.
// The scanner walks the ORIGINAL text by index, so every offset points into what the user wrote;
// normalisation (curly quotes, diacritics, case) happens only on the lookup form of each word.
// Patterns are compiled once at load and used sticky, so tokenising never compiles a regex.

import { ABBREVIATIONS, CURRENCIES, LEADING_ELISIONS, type Abbreviation, type Currency } from './abbreviations';
import { BARE, isAsciiLetter, MAX_BARE_LENGTH, plainWord } from './plainWords';
import { amountWords, cardinal, DIGIT_WORDS, isYear, moneyWords, ordinal, pluralise, yearWords } from './numberWords';
import { keepHiatusMarks } from './hiatus';

export interface Token {
  /** The written token as in the text, e.g. "Dr.", "3:30", "don't", "record(2)". */
  surface: string;
  /** Offset in the given text (UTF-16 index), plus the `offset` argument. */
  start: number;
  /** Exclusive. */
  end: number;
  kind: 'word' | 'number' | 'time' | 'ordinal' | 'money' | 'percent' | 'abbreviation' | 'symbol';
  /** Spoken words, lower case, apostrophes as ASCII "'" (["doctor"], ["three", "thirty"]). */
  words: string[];
  /** A written choice of listed pronunciation: "record(2)" -> 2 (words ["record"]). */
  variant: number | null;
  /** A phrase-break punctuation (, ; : . ! ? — – ( ) ellipsis) follows this token. */
  breakAfter: boolean;
}

type Kind = Token['kind'];

interface State {
  text: string;
  offset: number;
  tokens: Token[];
  /** A leading single quote was seen and not yet closed, so a trailing "s'" closes it. */
  openQuote: boolean;
}

const LETTER = /\p{L}/uy;
// Marks and joiners continue a word so decomposed "café" and Indic or Persian words stay whole.
const LETTER_RUN = /[\p{L}\p{M}\u00ad\u200c\u200d]+/uy;
const DOTTED = /[A-Za-z]+(?:\.[A-Za-z]+)*\./y;
const ORDINAL_SUFFIX = /(?:st|nd|rd|th)(?![\p{L}\p{N}])/iuy;
const PLURAL_SUFFIX = /['\u2018\u2019\u02bc\u2032]?s(?![\p{L}\p{N}])/uy;
// At most one space before am/pm; "a.m." keeps its periods, but a bare "pm." leaves its period as a break.
const AM_PM = /[ \u00a0]?(?:([AaPp])\.[Mm]\.|([AaPp])[Mm](?![\p{L}\p{N}]))/uy;
const SCALE = /\s+(thousand|million|billion|trillion)(?![\p{L}\p{N}])/iuy;
const CAPITAL_NEXT = /\s+\p{Lu}/uy;
const DECADE = /['\u2018\u2019\u02bc\u2032](\d)0s(?![\p{L}\p{N}])/uy;
const NON_LATIN_LETTER = /(?!\p{Script=Latin})\p{L}/u;
const MARKS = /\p{M}+/gu;
const SOFT_HYPHEN = /\u00ad/g;
const CURLY_APOSTROPHES = /[\u2018\u2019\u02bc\u2032]/g;
const COMMAS = /,/g;

const BARE_FIRST = new Set([...BARE.keys()].map((form) => form.charCodeAt(0)));

const BREAKS = new Set(
  // ASCII and typographic phrase punctuation, then the CJK, Arabic and Devanagari equivalents.
  [...',;:.!?\u2026()\u2013\u2014\u2015\u3001\u3002\uff0c\uff01\uff1f\uff1b\uff1a\u060c\u061b\u061f\u0964'].map(
    (ch) => ch.charCodeAt(0),
  ),
);

function at(re: RegExp, text: string, i: number): RegExpExecArray | null {
  re.lastIndex = i;
  return re.exec(text);
}

/**
 * The UTF-16 unit at i, or -1 outside the text. Scanners peek past both ends all the time, and
 * reading out of range with charCodeAt makes V8 throw away its optimised code once per function.
 */
function codeAt(text: string, i: number): number {
  return i >= 0 && i < text.length ? text.charCodeAt(i) : -1;
}

function isDigitAt(text: string, i: number): boolean {
  const c = codeAt(text, i);
  return c >= 0x30 && c <= 0x39;
}

function isLetterAt(text: string, i: number): boolean {
  const c = codeAt(text, i);
  if (c < 0) return false;
  if (c < 0x80) return (c >= 0x41 && c <= 0x5a) || (c >= 0x61 && c <= 0x7a);
  return at(LETTER, text, i) !== null;
}

function isAlnumAt(text: string, i: number): boolean {
  return isDigitAt(text, i) || isLetterAt(text, i);
}

/** ASCII ' and its typographic stand-ins (’ ‘ ʼ ′), all read as one apostrophe. */
function isApostrophe(c: number): boolean {
  return c === 0x27 || c === 0x2019 || c === 0x2018 || c === 0x02bc || c === 0x2032;
}

/** Hyphen-minus, Unicode hyphen and non-breaking hyphen join compounds; dashes are breaks. */
function isHyphen(c: number): boolean {
  return c === 0x2d || c === 0x2010 || c === 0x2011;
}

function digitsEnd(text: string, j: number): number {
  while (isDigitAt(text, j)) j++;
  return j;
}

function currencyAt(text: string, i: number): Currency | undefined {
  // Currency signs are all single UTF-16 units; skip the lookup for the many characters that are not.
  const c = codeAt(text, i);
  return c === 0x24 || c >= 0xa0 ? CURRENCIES.get(text[i]) : undefined;
}

function startsNumber(text: string, i: number): boolean {
  return isDigitAt(text, i) || (codeAt(text, i) === 0x2e && isDigitAt(text, i + 1));
}

function letterRunEnd(text: string, j: number): number {
  const n = text.length;
  while (j < n) {
    const c = text.charCodeAt(j);
    if ((c >= 0x41 && c <= 0x5a) || (c >= 0x61 && c <= 0x7a)) {
      j++;
    } else if (c >= 0x80) {
      const m = at(LETTER_RUN, text, j);
      if (m === null) break;
      j += m[0].length;
    } else {
      break;
    }
  }
  return j;
}

/**
 * The lookup form of a written word: ASCII apostrophes, lower case, and for Latin-script words
 * no diacritics (the dictionary spells "cafe", "jose") except a diaeresis that splits two vowels
 * ("thaïs", "naïve": core/hiatus.ts; dictionary lookups use the plain spelling). Other scripts
 * keep their marks, which carry vowels there, and are only composed (NFC) and lower-cased.
 */
export function lookupForm(raw: string): string {
  // Most words are plain ASCII and many already lower case: return those without allocating.
  let upper = false;
  for (let k = 0; k < raw.length; k++) {
    const c = raw.charCodeAt(k);
    if (c >= 0x80) return unicodeLookupForm(raw);
    if (c >= 0x41 && c <= 0x5a) upper = true;
  }
  return upper ? raw.toLowerCase() : raw;
}

function unicodeLookupForm(raw: string): string {
  const w = raw.replace(CURLY_APOSTROPHES, "'").replace(SOFT_HYPHEN, '').normalize('NFD');
  if (NON_LATIN_LETTER.test(w)) return w.normalize('NFC').toLowerCase();
  // A diaeresis that splits two vowels stays (core/hiatus.ts): "Thaïs" is not "thais".
  return (w.includes('\u0308') ? keepHiatusMarks(w) : w.replace(MARKS, '')).normalize('NFC').toLowerCase();
}

function push(
  st: State,
  start: number,
  end: number,
  kind: Kind,
  words: string[],
  variant: number | null = null,
  surface: string = st.text.slice(start, end),
) {
  st.tokens.push({
    surface,
    start: start + st.offset,
    end: end + st.offset,
    kind,
    words,
    variant,
    breakAfter: false,
  });
}

function markBreak(st: State): void {
  const last = st.tokens[st.tokens.length - 1];
  if (last !== undefined) last.breakAfter = true;
}

function scanTime(st: State, start: number, end: number, hour: number, minute: number): number {
  const words = cardinal(String(hour));
  const ampm = at(AM_PM, st.text, end);
  // "10:00" is said "ten o'clock", but "10:00 am" just "ten a m".
  if (minute === 0) {
    if (ampm === null) words.push("o'clock");
  } else if (minute < 10) {
    words.push('oh', DIGIT_WORDS[minute]);
  } else {
    words.push(...cardinal(String(minute)));
  }
  if (ampm !== null) {
    words.push((ampm[1] ?? ampm[2]).toLowerCase(), 'm');
    end += ampm[0].length;
  }
  push(st, start, end, 'time', words);
  return end;
}

/** Scans a number whose digits (or ".digit") begin at i; the token begins at start (sign or currency). */
function scanNumber(st: State, start: number, i: number, minus: boolean, currency: Currency | null): number {
  const { text } = st;
  const intEnd = digitsEnd(text, i);
  let j = intEnd;
  // "H:MM" or "HH:MM" with a real hour and minute is a time; "25:61" is two numbers.
  if (!minus && currency === null && j - i <= 2 && j > i && codeAt(text, j) === 0x3a &&
      isDigitAt(text, j + 1) && isDigitAt(text, j + 2) && !isDigitAt(text, j + 3)) {
    const hour = Number(text.slice(i, j));
    const minute = Number(text.slice(j + 1, j + 3));
    if (hour <= 23 && minute <= 59) return scanTime(st, start, j + 3, hour, minute);
  }
  // Thousands separators only in whole groups of three, so "1,2,3" stays a list of numbers.
  let grouped = false;
  if (j - i >= 1 && j - i <= 3) {
    while (codeAt(text, j) === 0x2c && digitsEnd(text, j + 1) === j + 4) {
      j += 4;
      grouped = true;
    }
  }
  const intText = text.slice(i, j);
  const digits = grouped ? intText.replace(COMMAS, '') : intText;
  let decimals: string | undefined;
  if (codeAt(text, j) === 0x2e && isDigitAt(text, j + 1)) {
    const end = digitsEnd(text, j + 1);
    decimals = text.slice(j + 1, end);
    j = end;
  }
  const plain = decimals === undefined && digits !== '';
  let kind: Kind = 'number';
  let words: string[];
  let suffix: RegExpExecArray | null;

  if (currency !== null) {
    kind = 'money';
    const scale = at(SCALE, text, j);
    if (scale !== null) {
      // "$5 million" is said "five million dollars".
      j += scale[0].length;
      words = [...amountWords(digits, decimals), scale[1].toLowerCase(), currency.many];
    } else {
      words = moneyWords(digits, decimals, currency);
    }
  } else if (plain && (suffix = at(ORDINAL_SUFFIX, text, j)) !== null) {
    kind = 'ordinal';
    words = ordinal(digits);
    j += suffix[0].length;
  } else if (codeAt(text, j) === 0x25 || (codeAt(text, j) === 0x20 && codeAt(text, j + 1) === 0x25)) {
    // "50%" and "50 %" are both said "fifty percent".
    kind = 'percent';
    words = [...amountWords(digits, decimals), 'percent'];
    j = text.indexOf('%', j) + 1;
  } else if (plain && !minus && intText.length <= 2 && Number(digits) >= 1 && Number(digits) <= 12 &&
      (suffix = at(AM_PM, text, j)) !== null) {
    kind = 'time';
    words = [...cardinal(String(Number(digits))), (suffix[1] ?? suffix[2]).toLowerCase(), 'm'];
    j += suffix[0].length;
  } else {
    // Four digits from 1100 to 2099 without commas are read as years, as in most scripts they are.
    words = plain && !minus && isYear(intText) ? yearWords(Number(intText)) : amountWords(digits, decimals);
    if (plain && (suffix = at(PLURAL_SUFFIX, text, j)) !== null) {
      words = pluralise(words);
      j += suffix[0].length;
    }
  }
  if (minus) words.unshift('minus');
  push(st, start, j, kind, words);
  return j;
}

// ---- Words and abbreviations ----------------------------------------------------------------

function abbreviationToken(st: State, start: number, end: number, words: readonly string[]): number {
  push(st, start, end, 'abbreviation', [...words]);
  return end;
}

function isCapitalAt(text: string, i: number): boolean {
  const c = codeAt(text, i);
  return c >= 0x41 && c <= 0x5a;
}

/** Tries an abbreviation at word start i whose first letter run ends at runEnd; returns its end or -1. */
function scanAbbreviation(st: State, i: number, runEnd: number): number {
  const { text } = st;
  const next = codeAt(text, runEnd);
  if (next === 0x2e) {
    const m = at(DOTTED, text, i);
    if (m === null) return -1;
    let raw = m[0];
    let entry = ABBREVIATIONS.get(raw.toLowerCase());
    if (entry === undefined) {
      // Dotted single letters ("U.K.", "D.C.") are spelled out.
      const letters = raw.slice(0, -1).split('.');
      if (letters.length >= 2 && letters.every((l) => l.length === 1)) {
        return abbreviationToken(st, i, i + raw.length, letters.map((l) => l.toLowerCase()));
      }
      raw = text.slice(i, runEnd + 1);
      entry = ABBREVIATIONS.get(raw.toLowerCase());
    }
    const end = i + raw.length;
    if (entry !== undefined) {
      const before = entry.beforeCapital !== undefined && at(CAPITAL_NEXT, text, end) !== null;
      return abbreviationToken(st, i, end, before && entry.beforeCapital ? entry.beforeCapital : entry.words);
    }
    // A capital initial between names ("John F. Kennedy", "J. Smith") is not a sentence end.
    if (raw.length === 2 && isCapitalAt(text, i) && at(CAPITAL_NEXT, text, end) !== null) {
      const prev = st.tokens[st.tokens.length - 1];
      if (prev === undefined || prev.breakAfter || isCapitalAt(prev.surface, 0)) {
        return abbreviationToken(st, i, end, [raw[0].toLowerCase()]);
      }
    }
    return -1;
  }
  // Undotted forms ("Mr Smith", "cats vs dogs"), when the word ends here. None is over 4 letters.
  if (runEnd - i > MAX_BARE_LENGTH || isApostrophe(next) || isHyphen(next) || isLetterAt(text, runEnd)) return -1;
  if (!BARE_FIRST.has(codeAt(text, i))) return -1;
  const entry = BARE.get(text.slice(i, runEnd));
  if (entry === undefined) return -1;
  const before = entry.beforeCapital !== undefined && at(CAPITAL_NEXT, text, runEnd) !== null;
  return abbreviationToken(st, i, runEnd, before && entry.beforeCapital ? entry.beforeCapital : entry.words);
}

/** A trailing apostrophe belongs to the word in "James'", "dogs'" and dropped-g "goin'". */
function keepsTrailingApostrophe(part: string): boolean {
  const w = lookupForm(part);
  return w.endsWith('s') || (w.length >= 4 && w.endsWith('in'));
}

function scanWord(st: State, i: number): number {
  const { text } = st;
  let j = letterRunEnd(text, i);
  const abbreviation = scanAbbreviation(st, i, j);
  if (abbreviation >= 0) return abbreviation;

  // Apostrophes between letters stay inside a part (don't, o'clock); hyphens start a new one.
  let words: string[] | null = null;
  let partStart = i;
  for (;;) {
    const c = codeAt(text, j);
    if (isApostrophe(c) && isLetterAt(text, j + 1)) {
      j = letterRunEnd(text, j + 1);
    } else if (isHyphen(c) && isLetterAt(text, j + 1)) {
      (words ??= []).push(lookupForm(text.slice(partStart, j)));
      partStart = j + 1;
      j = letterRunEnd(text, partStart);
    } else {
      break;
    }
  }
  let next = j;
  if (isApostrophe(codeAt(text, j)) && !isAlnumAt(text, j + 1)) {
    // The apostrophe is consumed either way: it is a possessive or it closes a quotation.
    next = j + 1;
    if (!st.openQuote && keepsTrailingApostrophe(text.slice(partStart, j))) j = next;
    else st.openQuote = false;
  }
  const lastPart = text.slice(partStart, j);
  // Most words have one part; a literal array is sized exactly, where push() would reserve 17 slots.
  if (words === null) words = [lookupForm(lastPart)];
  else words.push(lookupForm(lastPart));

  const v = codeAt(text, j + 1);
  if (next === j && codeAt(text, j) === 0x28 && v >= 0x31 && v <= 0x39 && codeAt(text, j + 2) === 0x29) {
    next = j + 3;
    push(st, i, next, 'word', words, v - 0x30);
  } else {
    // A one-part word is its own surface; sharing the string saves an allocation per word.
    push(st, i, j, 'word', words, null, partStart === i ? lastPart : text.slice(i, j));
  }
  return next;
}

/** A single quote outside a word: an elision ('n', 'til), a decade ('90s) or a quotation mark. */
function scanApostrophe(st: State, i: number): number {
  const { text } = st;
  const decade = at(DECADE, text, i);
  if (decade !== null) {
    const end = i + decade[0].length;
    // "'90s" -> nineties; "'00s" names the decade after 2000 ("two thousands"), not zeros.
    const words = decade[1] === '0' ? ['two', 'thousand'] : cardinal(`${decade[1]}0`);
    push(st, i, end, 'number', pluralise(words));
    return end;
  }
  if (isLetterAt(text, i + 1)) {
    let end = letterRunEnd(text, i + 1);
    const form = `'${lookupForm(text.slice(i + 1, end))}`;
    const c = codeAt(text, end);
    const continues = (isApostrophe(c) || isHyphen(c)) && isLetterAt(text, end + 1);
    if (LEADING_ELISIONS.has(form) && !continues) {
      if (form === "'n" && isApostrophe(c)) end++; // 'n' is written between two apostrophes.
      push(st, i, end, 'word', [form]);
      return end;
    }
    st.openQuote = true;
  } else {
    st.openQuote = false;
  }
  return i + 1;
}

function scanHyphen(st: State, i: number, c: number): number {
  const { text } = st;
  const afterWord = isAlnumAt(text, i - 1);
  if (!afterWord && (c === 0x2d || c === 0x2212)) {
    if (startsNumber(text, i + 1)) return scanNumber(st, i, i + 1, true, null);
    const currency = currencyAt(text, i + 1);
    if (currency !== undefined && startsNumber(text, i + 2)) return scanNumber(st, i, i + 2, true, currency);
  }
  // Between letters or digits ("5-year-old", "COVID-19", "10-20") a hyphen is neither word nor pause.
  if (afterWord && isAlnumAt(text, i + 1) && c !== 0x2212) return i + 1;
  // Leading, trailing, spaced or doubled ("--") hyphens are used as dashes.
  markBreak(st);
  return i + 1;
}

function scanOther(st: State, i: number, c: number): number {
  const { text } = st;
  if (isApostrophe(c)) return scanApostrophe(st, i);
  if (isHyphen(c) || c === 0x2212) return scanHyphen(st, i, c);
  if (c === 0x2e && isDigitAt(text, i + 1) && !isDigitAt(text, i - 1)) return scanNumber(st, i, i, false, null);
  const currency = currencyAt(text, i);
  if (currency !== undefined && startsNumber(text, i + 1)) return scanNumber(st, i, i + 1, false, currency);
  if (c === 0x26) {
    push(st, i, i + 1, 'symbol', ['and']);
    return i + 1;
  }
  if (BREAKS.has(c)) markBreak(st);
  // Anything else (quotes, emoji, * # /) is not spoken and is skipped whole, surrogate pairs included.
  const pair = c >= 0xd800 && c <= 0xdbff && (codeAt(text, i + 1) & 0xfc00) === 0xdc00;
  return i + (pair ? 2 : 1);
}

/** A plain word at i (plainWords.ts) as its token; returns the end, or -1 to leave it to `scanWord`. */
function scanPlainWord(st: State, i: number): number {
  const word = plainWord(st.text, i);
  if (word === null) return -1;
  st.tokens.push({
    surface: word.surface,
    start: i + st.offset,
    end: word.end + st.offset,
    kind: 'word',
    words: [word.spoken],
    variant: null,
    breakAfter: false,
  });
  return word.end;
}

/**
 * Tokenises one item (a sentence or phrase). Offsets index `text` exactly as given, plus `offset`.
 * Never throws; unspeakable characters are skipped.
 */
export function tokenize(text: string, offset = 0): Token[] {
  return tokenizeWith(text, offset, true);
}

/** `tokenize`, with the plain-word fast path on or off (off only to test that both agree). */
export function tokenizeWith(text: string, offset: number, fast: boolean): Token[] {
  const st: State = { text, offset, tokens: [], openQuote: false };
  const n = text.length;
  let i = 0;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (c <= 0x20) i++;
    else if (c >= 0x30 && c <= 0x39) i = scanNumber(st, i, i, false, null);
    else if (fast && isAsciiLetter(c)) {
      const end = scanPlainWord(st, i);
      i = end >= 0 ? end : scanWord(st, i);
    } else if (isLetterAt(text, i)) i = scanWord(st, i);
    else i = scanOther(st, i, c);
  }
  // The period of an abbreviation ("etc.", "p.m.") is a break only when it ends the item.
  const last = st.tokens[st.tokens.length - 1];
  if (last !== undefined && last.surface.endsWith('.')) last.breakAfter = true;
  return st.tokens;
}

/** Total spoken words in the tokens (the count pacing uses): 0 for none, symbols without words add 0. */
export function spokenWordCount(tokens: Token[]): number {
  let n = 0;
  for (const t of tokens) n += t.words.length;
  return n;
}
