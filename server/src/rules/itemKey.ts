// The key duplicate-item compares items by, and a quick path for the usual plain item. Kept apart
// from the rule so the rule file stays its metadata and check.
import { plainSpelling } from '../core/hiatus';
import { lookupForm } from '../core/tokenize';
import type { RungAnalysis } from '../core/types';

/**
 * Two items are the same when their spoken words match, ignoring case, accents, punctuation and
 * spacing: the key is the text without the accents of Latin letters ("Café" is spoken "cafe",
 * and "Zoë" is keyed "zoe" though looked up with its diaeresis), in lower case, with every run of other characters one space. The rule
 * compares key numbers (keyHash) and builds keys only when two numbers meet.
 */
export function spokenKey(text: string): string {
  return plainSpokenKey(text) ?? generalSpokenKey(text);
}

/** A run of letters (with their marks and apostrophes): one word as far as lookups go. */
const LETTER_RUN = /[\p{L}\p{M}'\u2018\u2019\u02bc\u2032]+/gu;

export function generalSpokenKey(text: string): string {
  // Each run of letters in its lookup form (core/tokenize.ts: lower case, ASCII apostrophes, a
  // Latin-script word without its accents) with its plain spelling (no diaeresis either: "Zoë
  // came" repeats "Zoe came"), so the key ignores the accents of Latin letters.
  return text
    .replace(LETTER_RUN, (run) => plainSpelling(lookupForm(run)))
    .replace(/[^\p{L}\p{N}'()]+/gu, ' ')
    .trim();
}

/** ASCII letters, digits, ' ( and ): what the general key keeps of ASCII text. */
function kept(c: number): boolean {
  return (c >= 0x61 && c <= 0x7a) || (c >= 0x41 && c <= 0x5a) || (c >= 0x30 && c <= 0x39) || c === 0x27 || c === 0x28 || c === 0x29;
}

/**
 * The key of the usual item without a regular expression: ASCII words separated by single spaces,
 * with any punctuation only at the end ("My sister bought the bread."). Its key is its lower-case
 * text up to the last kept character, whose length this returns; -1 for anything else, which
 * takes the general key. tests/rules/duplicateKey.property.test.ts checks the two agree.
 */
function plainKeyEnd(text: string): number {
  const n = text.length;
  let end = 0;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0x80) return -1;
    if (!kept(c)) continue;
    // Between two kept characters only one space may stand; nothing may stand before the first.
    if (i !== end && (end === 0 || i !== end + 1 || text.charCodeAt(end) !== 0x20)) return -1;
    end = i + 1;
  }
  return end;
}

function plainSpokenKey(text: string): string | null {
  const end = plainKeyEnd(text);
  return end < 0 ? null : text.slice(0, end).toLowerCase();
}

/** Per ASCII code: the character the key keeps for it (lower case), or 0 when it is left out. */
const KEY_CHAR = new Uint8Array(128).map((_, c) => (kept(c) ? (c >= 0x41 && c <= 0x5a ? c + 0x20 : c) : 0));

/**
 * A small number equal keys share (FNV-1a over the key's characters), or -1 for an empty key.
 * For ASCII text it is found without building the key, so a script of 10,000 different items
 * builds no key at all; items whose numbers meet are compared by their keys.
 */
export function keyHash(text: string): number {
  // One pass over ASCII text: the key's characters are its kept characters, lower-cased, with one
  // space for each run of other characters between two of them (what the general key makes of
  // ASCII: every other character is neither a letter nor a digit, and the ends are trimmed).
  let h = 0x811c9dc5;
  let started = false;
  let gap = false;
  const n = text.length;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0x80) return generalKeyHash(text);
    const k = KEY_CHAR[c];
    if (k === 0) {
      gap = started;
      continue;
    }
    if (gap) {
      h = Math.imul(h ^ 0x20, 0x01000193);
      gap = false;
    }
    h = Math.imul(h ^ k, 0x01000193);
    started = true;
  }
  return started ? h & 0x3fffffff : -1;
}

function generalKeyHash(text: string): number {
  const key = generalSpokenKey(text);
  if (key === '') return -1;
  let h = 0x811c9dc5;
  for (let i = 0; i < key.length; i++) h = Math.imul(h ^ key.charCodeAt(i), 0x01000193);
  return h & 0x3fffffff;
}

/**
 * The key numbers of a rung's items, kept with the rung's analysis: the language server hands
 * back the same analysis for every rung an edit did not touch, so their numbers are not worked
 * out again on each keystroke (one entry per rung, where a cache per item would cost a fresh
 * analysis more than the numbers).
 */
const byRung = new WeakMap<RungAnalysis, Int32Array>();

export function rungKeyHashes(r: RungAnalysis): Int32Array {
  let hs = byRung.get(r);
  if (hs === undefined) {
    hs = new Int32Array(r.items.length);
    for (let k = 0; k < hs.length; k++) hs[k] = keyHash(r.items[k].node.text);
    byRung.set(r, hs);
  }
  return hs;
}
