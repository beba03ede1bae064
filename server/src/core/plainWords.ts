// The tokenizer's fast path for plain words, shared with the analysis. A plain word is a run of
// ASCII letters that ends where nothing can join it to more (not a letter, mark, apostrophe,
// hyphen or variant mark, nor a period that makes it an abbreviation or an initial) and is not an
// undotted abbreviation: the general scanner makes it one word whose spoken form is its lower
// case. A plain item is one the tokenizer reads as plain words only, with nothing between them
// but spaces and punctuation it skips; the analysis scores such an item without building tokens.
// tests/core/tokenize.property.test.ts checks both against the general scanner on arbitrary text.
import { ABBREVIATIONS, type Abbreviation } from './abbreviations';

// The longest abbreviation recognised without its period ("prof", "blvd"); longer words skip the lookup.
export const MAX_BARE_LENGTH = 4;

// Undotted abbreviations keyed by how they may be written ("Mr", "MR"; "vs", "Vs", "VS"), so a
// word needs one lookup of its own spelling and no lower-casing.
export const BARE = new Map<string, Abbreviation>();
for (const [written, entry] of ABBREVIATIONS) {
  if (entry.bare === undefined) continue;
  const lower = written.slice(0, -1);
  const forms = [lower[0].toUpperCase() + lower.slice(1), lower.toUpperCase()];
  if (entry.bare === 'any') forms.push(lower);
  for (const form of forms) BARE.set(form, entry);
}
/** A plain word: its end (exclusive), its text and its spoken form. */
export interface PlainWord {
  end: number;
  surface: string;
  spoken: string;
}

export function isAsciiLetter(c: number): boolean {
  return (c >= 0x61 && c <= 0x7a) || (c >= 0x41 && c <= 0x5a);
}

/** The plain word starting at i (an ASCII letter), or null when the general scanner must read it. */
export function plainWord(text: string, i: number): PlainWord | null {
  const n = text.length;
  let j = i;
  let upper = false;
  let c = 0;
  for (; j < n; j++) {
    c = text.charCodeAt(j);
    if (c >= 0x61 && c <= 0x7a) continue;
    if (c >= 0x41 && c <= 0x5a) {
      upper = true;
      continue;
    }
    break;
  }
  if (j < n && (c >= 0x80 || c === 0x27 || c === 0x2d || c === 0x28)) return null;
  const surface = text.slice(i, j);
  const spoken = upper ? surface.toLowerCase() : surface;
  if (j < n && c === 0x2e) {
    // A period after the word (most often the item's last): a word unless the letters go on
    // ("e.g."), it is a listed abbreviation ("etc.", "Dr.") or a capital initial ("J. Smith").
    const after = j + 1 < n ? text.charCodeAt(j + 1) : -1;
    if (isAsciiLetter(after)) return null;
    if ((j - i === 1 && upper) || ABBREVIATIONS.has(`${spoken}.`)) return null;
  } else if (j - i <= MAX_BARE_LENGTH && BARE.has(surface)) return null;
  return { end: j, surface, spoken };
}

/**
 * ASCII characters the tokenizer skips between words without a token or any state: spaces and
 * controls, and punctuation other than the apostrophe, hyphen, ampersand and parentheses (which
 * start elisions, compounds, "and" and variant marks). Digits start numbers.
 */
function skipped(c: number): boolean {
  if (c <= 0x20) return true;
  if (c >= 0x80 || (c >= 0x30 && c <= 0x39) || isAsciiLetter(c)) return false;
  return c !== 0x27 && c !== 0x2d && c !== 0x26 && c !== 0x28 && c !== 0x29;
}

/** The words of a plain item, in order (offsets in `text`), or null when any part of it is not plain. */
export function plainItemWords(text: string): PlainWord[] | null {
  const words: PlainWord[] = [];
  const n = text.length;
  let i = 0;
  while (i < n) {
    const c = text.charCodeAt(i);
    if (isAsciiLetter(c)) {
      const w = plainWord(text, i);
      if (w === null) return null;
      words.push(w);
      i = w.end;
    } else if (skipped(c)) i++;
    else return null;
  }
  return words;
}
