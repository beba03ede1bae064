// The rule engine for the NRL letter-to-sound rules in rules.ts: it turns a spelling into CMU
// ARPAbet phones, for words the dictionary does not list. Pure and allocation-light: it is called
// once per unknown word and keeps no cache.

import { LETTER_NAMES, LTS_RULES, type LtsRule } from './rules';

const VOWELS = 'AEIOU';
const VOICED = 'BDVGJLMNRWZ';
const FRONT = 'EIY';
const SIBILANTS = 'SCGZXJ';
const LONG_U_CONSONANTS = 'TSRDLZNJ';

function isLetter(c: string | undefined): boolean {
  return c !== undefined && c >= 'A' && c <= 'Z';
}
/**
 * Whether text[p] is a vowel letter for the contexts. The report counts only A E I O U; here a Y
 * after a consonant and not before a vowel counts too ("tyke", "scythe", "myth"), so that rules
 * like `#:[E] =` (silent final e) see the vowel it spells. A departure, measured to help.
 */
function vowelAt(text: string, p: number): boolean {
  const c = text[p];
  if (c !== undefined && c.length === 1 && VOWELS.includes(c)) return true;
  if (c === 'Y') {
    const before = text[p - 1];
    const after = text[p + 1];
    return isLetter(before) && !VOWELS.includes(before) && before !== 'Y' && !(after !== undefined && VOWELS.includes(after));
  }
  return false;
}
function consonantAt(text: string, p: number): boolean {
  return isLetter(text[p]) && !vowelAt(text, p);
}
function isIn(set: string, c: string | undefined): boolean {
  return c !== undefined && c.length === 1 && set.includes(c);
}

/** Matches a left context, read from its right end leftwards starting at text[pos]. */
function matchLeft(pattern: string, text: string, pos: number): boolean {
  let p = pos;
  for (let k = pattern.length - 1; k >= 0; k--) {
    const sym = pattern[k];
    const c = text[p];
    switch (sym) {
      case ' ':
        if (isLetter(c)) return false;
        p--;
        break;
      case '#':
        if (!vowelAt(text, p)) return false;
        while (vowelAt(text, p)) p--;
        break;
      case ':':
        while (consonantAt(text, p)) p--;
        break;
      case '*':
        if (!consonantAt(text, p)) return false;
        while (consonantAt(text, p)) p--;
        break;
      case '^':
        if (!consonantAt(text, p)) return false;
        p--;
        break;
      case '.':
        if (!isIn(VOICED, c)) return false;
        p--;
        break;
      case '+':
        if (!isIn(FRONT, c)) return false;
        p--;
        break;
      case '$':
        if (!consonantAt(text, p) || !isIn('EI', text[p + 1])) return false;
        p--;
        break;
      case '&':
        if (c === 'H' && isIn('CS', text[p - 1])) p -= 2;
        else if (isIn(SIBILANTS, c)) p--;
        else return false;
        break;
      case '@':
        if (c === 'H' && isIn('TCS', text[p - 1])) p -= 2;
        else if (isIn(LONG_U_CONSONANTS, c)) p--;
        else return false;
        break;
      default:
        if (c !== sym) return false;
        p--;
    }
  }
  return true;
}

/** Matches a right context, read from its left end rightwards starting at text[pos]. */
function matchRight(pattern: string, text: string, pos: number): boolean {
  let p = pos;
  for (let k = 0; k < pattern.length; k++) {
    const sym = pattern[k];
    const c = text[p];
    switch (sym) {
      case ' ':
        if (isLetter(c)) return false;
        p++;
        break;
      case '#':
        if (!vowelAt(text, p)) return false;
        while (vowelAt(text, p)) p++;
        break;
      case ':':
        while (consonantAt(text, p)) p++;
        break;
      case '*':
        if (!consonantAt(text, p)) return false;
        while (consonantAt(text, p)) p++;
        break;
      case '^':
        if (!consonantAt(text, p)) return false;
        p++;
        break;
      case '.':
        if (!isIn(VOICED, c)) return false;
        p++;
        break;
      case '+':
        if (!isIn(FRONT, c)) return false;
        p++;
        break;
      case '$':
        if (!consonantAt(text, p) || !isIn('EI', text[p + 1])) return false;
        p += 2;
        break;
      case '%':
        // The report's suffixes ER, E, ES, ED, ING, ELY; the longest one present is taken.
        if (c === 'E') {
          p++;
          if (text[p] === 'L' && text[p + 1] === 'Y') p += 2;
          else if (isIn('RSD', text[p])) p++;
        } else if (c === 'I' && text[p + 1] === 'N' && text[p + 2] === 'G') {
          p += 3;
        } else {
          return false;
        }
        // The report's suffix must end the word here: read mid-word, "[I]%" makes two vowels of
        // the ie of "field" and "achieve". A departure from the report, measured to help.
        if (isLetter(text[p])) return false;
        break;
      case '&':
        if (isIn('CS', c) && text[p + 1] === 'H') p += 2;
        else if (isIn(SIBILANTS, c)) p++;
        else return false;
        break;
      case '@':
        if (isIn('TCS', c) && text[p + 1] === 'H') p += 2;
        else if (isIn(LONG_U_CONSONANTS, c)) p++;
        else return false;
        break;
      default:
        if (c !== sym) return false;
        p++;
    }
  }
  return true;
}

function findRule(text: string, i: number): LtsRule | undefined {
  const rules = LTS_RULES.get(text[i]);
  if (rules === undefined) return undefined;
  for (const rule of rules) {
    if (
      text.startsWith(rule.match, i) &&
      matchLeft(rule.left, text, i - 1) &&
      matchRight(rule.right, text, i + rule.match.length)
    ) {
      return rule;
    }
  }
  return undefined;
}

/**
 * Spellings whose vowel is rarely stressed at the start of a longer word ("about", "before",
 * "confuse", "repeat"). Part of the stress heuristic below, not of the NRL rules.
 */
const UNSTRESSED_PREFIXES = ['A', 'BE', 'DE', 'RE', 'CON', 'COM', 'EX', 'PRO', 'DIS', 'MIS', 'OB', 'SUB', 'PER'];

function isVowelPhone(phone: string): boolean {
  const c = phone[0];
  return c === 'A' || c === 'E' || c === 'I' || c === 'O' || c === 'U';
}

/**
 * Adds stress digits, by a heuristic (the NRL rules assign no stress): the first vowel that is not
 * already marked reduced (the report's schwa arrives as AH0) and does not come from an unstressed
 * prefix spelling gets primary stress 1, every other vowel 0. With no such vowel, the first vowel
 * takes the stress. `starts` gives, per phone, the index in `letters` where its spelling began.
 */
function assignStress(phones: string[], starts: number[], letters: string): string[] {
  const vowelIndexes: number[] = [];
  for (let k = 0; k < phones.length; k++) if (isVowelPhone(phones[k])) vowelIndexes.push(k);
  if (vowelIndexes.length === 0) return phones;
  let prefixLength = 0;
  if (vowelIndexes.length > 1) {
    for (const prefix of UNSTRESSED_PREFIXES) {
      if (!letters.startsWith(prefix) || letters.length < prefix.length + 3) continue;
      // A lone a- is a prefix only before one consonant and a vowel (about, alone; not apple).
      if (prefix === 'A' && !/^A[^AEIOUY][AEIOUY]/.test(letters)) continue;
      prefixLength = prefix.length;
    }
  }
  const candidates = vowelIndexes.filter((k) => !/\d$/.test(phones[k]));
  const primary =
    candidates.find((k) => starts[k] >= prefixLength) ?? candidates[0] ?? vowelIndexes[0];
  return phones.map((phone, k) => {
    if (!isVowelPhone(phone)) return phone;
    const bare = phone.replace(/\d$/, '');
    return bare + (k === primary ? '1' : '0');
  });
}

/** Reads a spelling letter by letter, as an abbreviation. */
function spellOut(letters: string): string[] {
  const phones: string[] = [];
  const names = [...letters].filter((c) => LETTER_NAMES[c] !== undefined);
  names.forEach((c, k) => {
    // The last letter name takes the primary stress and the others secondary, as in CMU's "cd"
    // (S IY2 D IY1); CMU is not consistent here ("dnc" = D IY1 EH2 N S IY2).
    const last = k === names.length - 1;
    for (const phone of LETTER_NAMES[c]) phones.push(phone.replace('1', last ? '1' : '2'));
  });
  return phones;
}

/**
 * Estimates the CMU ARPAbet phones of a spelling with the NRL letter-to-sound rules, stress digits
 * on every vowel (a heuristic; see `assignStress`). Letters a-z and the apostrophe are used, case
 * ignored; any other character is skipped. Returns [] for a spelling with no letters.
 */
export function letterToSound(word: string): string[] {
  const letters = word.toUpperCase().replace(/[^A-Z']/g, '');
  if (letters === '') return [];
  // A spelling with no vowel letter at all is read letter by letter, as an abbreviation ("dnc",
  // "sql"); the report's rules would give it no syllable. A departure from the report.
  if (!/[AEIOUY]/.test(letters)) return spellOut(letters);
  const text = ` ${letters} `;
  const phones: string[] = [];
  const starts: number[] = [];
  let i = 1;
  while (i < text.length - 1) {
    const rule = findRule(text, i);
    if (rule === undefined) {
      i++;
      continue;
    }
    for (const phone of rule.phones) {
      // A doubled consonant letter read by two single-letter rules ("tt", "pp") is one sound.
      // This collapse is a departure from the report, which spells out only LL, GG, SS and CK.
      if (phone === phones[phones.length - 1] && !isVowelPhone(phone)) continue;
      phones.push(phone);
      starts.push(i - 1);
    }
    i += rule.match.length;
  }
  return assignStress(phones, starts, letters);
}
