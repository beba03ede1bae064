// Pronunciations for words the dictionary does not list. Morphology comes first: many unknown
// words in scripts are an inflection, a derivation or a compound of listed words. A plural or
// possessive of a listed stem is taken as it is; any other analysis is one reading among the
// trained estimator's (a joint-sequence model, core/g2p), since on words hidden from the lookup
// the estimator read derivations and would-be compounds better than building on a stem did
// (estimatePronunciation below). The NRL letter-to-sound rules remain only for when no model is
// loaded, since the estimator beats them on every measure on the held-out words (README, "Words
// not in the dictionary").
import type { Candidate } from '../g2p/decode';
import type { WordData } from '../types';
import { letterToSound } from './letterToSound';
import { hiatusOf } from '../hiatus';

export interface Estimate {
  /** CMU ARPAbet phones, stress digits on vowels. */
  phones: string[];
  source: 'morphology' | 'estimate';
  /** In words, how the phones were found, e.g. "stem 'bake' + -ing". */
  how: string;
  /** The estimator's ranked candidates with their scores (the first is `phones`); else empty. */
  alternatives: Candidate[];
}

interface Analysis {
  phones: string[];
  how: string;
  /**
   * A listed stem with only plural or possessive endings ("cat" + -s, "boxes", "cat's"): taken as
   * it is. Any other analysis is weighed against the estimator's own readings (below).
   */
  settled: boolean;
}

const SIBILANT_PHONES = new Set(['S', 'Z', 'SH', 'ZH', 'CH', 'JH']);
const VOICELESS_PHONES = new Set(['P', 'T', 'K', 'F', 'TH', 'S', 'SH', 'CH', 'HH']);

function isVowelPhone(phone: string): boolean {
  return /\d$/.test(phone);
}

/** The first listed pronunciation of a word, `# comment` stripped, or undefined. */
function listed(word: string, data: WordData): string[] | undefined {
  const first = data.pronunciations(word)?.[0];
  if (first === undefined) return undefined;
  const phones = first.replace(/#.*$/, '').trim().split(/\s+/).filter((p) => p !== '');
  return phones.length > 0 ? phones : undefined;
}

function vowelGroups(spelling: string): number {
  return spelling.match(/[aeiouy]+/g)?.length ?? 0;
}

function syllables(phones: string[]): number {
  return phones.filter(isVowelPhone).length;
}

/**
 * A listed word fit to be a stem: its pronunciation must not have more syllables than its
 * spelling has vowel groups, which turns away letter-by-letter readings of abbreviations
 * ("abc" = EY1 B IY1 S IY1) that would otherwise poison every word they seem to be part of.
 */
function stem(word: string, data: WordData): string[] | undefined {
  if (word.length < 2) return undefined;
  const phones = listed(word, data);
  if (phones === undefined) return undefined;
  if (syllables(phones) > Math.max(1, vowelGroups(word))) return undefined;
  return phones;
}

/** True when the spelling ends in one short vowel letter and one consonant ("bak", "hop"). */
function endsShortClosed(spelling: string): boolean {
  return /(^|[^aeiou])[aeiou][^aeiouwxy]$/.test(spelling);
}

/**
 * The spellings a suffix may have been added to, most likely first: the bare stem ("walk-ing"),
 * a stem that lost its final e ("bak-ing" from "bake"), and a stem whose final consonant was
 * doubled ("runn-ing" from "run"). A short closed bare stem is tried after its e form, since
 * English doubles the consonant after a short vowel: "baking" comes from "bake", not "bak".
 * A remainder ending in a vowel letter is taken as it is ("sne" + e would make "sneer" a snee-er).
 */
function stemSpellings(base: string): string[] {
  const out: string[] = [];
  if (/[aeiouy]$/.test(base)) return [base];
  const doubled = base.length >= 3 && base[base.length - 1] === base[base.length - 2] && !/[aeiou]$/.test(base);
  if (endsShortClosed(base)) out.push(`${base}e`, base);
  else out.push(base, `${base}e`);
  if (doubled) out.push(base.slice(0, -1));
  return out;
}

function plural(phones: string[]): string[] {
  const last = phones[phones.length - 1];
  if (SIBILANT_PHONES.has(last)) return [...phones, 'IH0', 'Z'];
  if (VOICELESS_PHONES.has(last)) return [...phones, 'S'];
  return [...phones, 'Z'];
}

function past(phones: string[]): string[] {
  const last = phones[phones.length - 1];
  if (last === 'T' || last === 'D') return [...phones, 'IH0', 'D'];
  if (VOICELESS_PHONES.has(last)) return [...phones, 'T'];
  return [...phones, 'D'];
}

/** Removes a stem's final IY (the y of "happy"), which a suffix spelt with i re-adds ("happier"). */
function withoutFinalY(phones: string[]): string[] {
  const last = phones[phones.length - 1];
  return last !== undefined && last.startsWith('IY') ? phones.slice(0, -1) : phones;
}

type Build = (phones: string[]) => string[];

interface Suffix {
  /** Spelling removed from the end of the word. */
  ending: string;
  /** Label used in `how`. */
  label: string;
  /** Spellings of the stem, given the word minus the ending. */
  stems: (base: string) => string[];
  build: Build;
  /** Whether the stem (its phones and spelling) can take this suffix; default yes. */
  accepts?: (phones: string[], spelling: string) => boolean;
}

const add =
  (...extra: string[]): Build =>
  (phones) => [...phones, ...extra];
const bare = (base: string): string[] => [base];
const yStem = (base: string): string[] => [`${base}y`];

/** Suffixes, longest and most specific first. */
const SUFFIXES: readonly Suffix[] = [
  { ending: "'s", label: "-'s", stems: bare, build: plural },
  { ending: "s'", label: "-s'", stems: bare, build: plural },
  { ending: 'iness', label: '-ness', stems: yStem, build: (p) => [...withoutFinalY(p), 'IY0', 'N', 'AH0', 'S'] },
  { ending: 'ness', label: '-ness', stems: bare, build: add('N', 'AH0', 'S') },
  { ending: 'less', label: '-less', stems: bare, build: add('L', 'AH0', 'S') },
  { ending: 'ful', label: '-ful', stems: bare, build: add('F', 'AH0', 'L') },
  { ending: 'ment', label: '-ment', stems: bare, build: add('M', 'AH0', 'N', 'T') },
  // CMU keeps no syllable for the -al- of -ically ("basically" = B EY1 S IH0 K L IY0).
  { ending: 'ally', label: '-ally', stems: bare, build: add('L', 'IY0'), accepts: (_p, spelling) => spelling.endsWith('ic') },
  { ending: 'ily', label: '-ly', stems: yStem, build: (p) => [...withoutFinalY(p), 'AH0', 'L', 'IY0'] },
  { ending: 'ly', label: '-ly', stems: bare, build: add('L', 'IY0') },
  { ending: 'ies', label: '-s', stems: yStem, build: add('Z') },
  { ending: 'ied', label: '-ed', stems: yStem, build: add('D') },
  { ending: 'ier', label: '-er', stems: yStem, build: (p) => (p[p.length - 1].startsWith('AY') ? [...p, 'ER0'] : [...withoutFinalY(p), 'IY0', 'ER0']) },
  { ending: 'iest', label: '-est', stems: yStem, build: (p) => [...withoutFinalY(p), 'IY0', 'AH0', 'S', 'T'] },
  { ending: 'ing', label: '-ing', stems: stemSpellings, build: add('IH0', 'NG') },
  { ending: 'est', label: '-est', stems: stemSpellings, build: add('AH0', 'S', 'T') },
  { ending: 'ed', label: '-ed', stems: stemSpellings, build: past },
  { ending: 'er', label: '-er', stems: stemSpellings, build: add('ER0') },
  { ending: 'es', label: '-es', stems: bare, build: plural, accepts: (p, spelling) => SIBILANT_PHONES.has(p[p.length - 1]) || spelling.endsWith('o') },
  { ending: 's', label: '-s', stems: bare, build: plural },
];

/** Demotes primary stress to secondary, for the second part of a compound ("dog-HOUSE"). */
function secondary(phones: string[]): string[] {
  return phones.map((p) => (p.endsWith('1') ? `${p.slice(0, -1)}2` : p));
}

function resolveStem(word: string, data: WordData, depth: number): Analysis | undefined {
  const phones = stem(word, data);
  if (phones !== undefined) return { phones, how: `'${word}'`, settled: true };
  // A stem that is itself analysed ("walker" in "walkers") keeps its own explanation.
  return depth > 0 ? analyzeWord(word, data, depth - 1) : undefined;
}

function trySuffixes(word: string, data: WordData, depth: number): Analysis | undefined {
  for (const suffix of SUFFIXES) {
    if (!word.endsWith(suffix.ending) || word.length - suffix.ending.length < 2) continue;
    if (suffix.ending === 's' && /(ss|us|is)$/.test(word)) continue;
    const base = word.slice(0, -suffix.ending.length);
    for (const spelling of suffix.stems(base)) {
      // Only the bare remainder may itself be analysed: a restored e or undoubled consonant on
      // top of a guessed analysis is too far from the evidence ("everyth" + e = "every" + "the").
      const found = resolveStem(spelling, data, spelling === base ? depth : 0);
      if (found !== undefined && (suffix.accepts === undefined || suffix.accepts(found.phones, spelling))) {
        return { phones: suffix.build(found.phones), how: `${found.how} + ${suffix.label}`, settled: found.settled && suffix.build === plural };
      }
    }
  }
  return undefined;
}

/** True when a cut between `first` and `second` splits a spelling digraph (s|h, t|h, c|h, p|h, w|h, g|h). */
function splitsDigraph(first: string, second: string): boolean {
  return second[0] === 'h' && /[cgpstw]$/.test(first);
}

/**
 * Two listed words of three letters or more, the longest first part preferred; a cut that splits
 * a digraph is taken only when no other cut works ("black" + "shire" before "blacks" + "hire",
 * but "dog" + "house" when that is the only reading).
 */
function tryCompound(word: string, data: WordData): Analysis | undefined {
  let fallback: Analysis | undefined;
  for (let cut = word.length - 3; cut >= 3; cut--) {
    const first = word.slice(0, cut);
    const second = word.slice(cut);
    const digraph = splitsDigraph(first, second);
    if (digraph && fallback !== undefined) continue;
    // Both parts must be words people say (seen in SUBTLEX-US): the dictionary also lists
    // fragments and rare names ("lep", "hege") that make false compounds.
    if (data.count(first) === 0 || data.count(second) === 0) continue;
    const a = stem(first, data);
    if (a === undefined) continue;
    const b = stem(second, data);
    if (b === undefined) continue;
    const found = { phones: [...a, ...secondary(b)], how: `compound '${first}' + '${second}'`, settled: false };
    if (!digraph) return found;
    fallback = found;
  }
  return fallback;
}

function analyzeWord(word: string, data: WordData, depth: number): Analysis | undefined {
  return trySuffixes(word, data, depth) ?? tryCompound(word, data);
}

/** How many ranked candidates the estimator returns (shown in hovers, offered as quick fixes). */
export const ALTERNATIVES = 5;
export const ESTIMATOR_HOW = 'joint-sequence model';
/** How an estimate of a word with a diaeresis between two vowels was made (core/hiatus.ts). */
export const HIATUS_HOW = 'joint-sequence model, the vowels at the diaeresis said apart';

/**
 * The names of the consonant letters as the CMU Pronouncing Dictionary lists the letters (its
 * first entry for each; tests/core/estimator.test.ts holds the two equal).
 */
export const LETTER_NAMES: Readonly<Record<string, readonly string[]>> = {
  b: ['B', 'IY1'], c: ['S', 'IY1'], d: ['D', 'IY1'], f: ['EH1', 'F'], g: ['JH', 'IY1'], h: ['EY1', 'CH'],
  j: ['JH', 'EY1'], k: ['K', 'EY1'], l: ['EH1', 'L'], m: ['EH1', 'M'], n: ['EH1', 'N'], p: ['P', 'IY1'],
  q: ['K', 'Y', 'UW1'], r: ['AA1', 'R'], s: ['EH1', 'S'], t: ['T', 'IY1'], v: ['V', 'IY1'],
  w: ['D', 'AH1', 'B', 'AH0', 'L', 'Y', 'UW0'], x: ['EH1', 'K', 'S'], z: ['Z', 'IY1'],
};

export const SPELLED_HOW = 'said letter by letter';

/**
 * An unlisted spelling of two to eight letters with no vowel letter (a, e, i, o, u, y), such as
 * "nhs" or "gp", is an initialism said letter by letter, with a final 's as Z (the longest the
 * dictionary lists has five letters; a longer run is no initialism and goes on as before). That
 * is how the dictionary reads most of the words of this shape it lists: outside the held-out
 * tenth, 102 of 139 phones exact and 112 syllables exact; in the held-out tenth 11 and 14 of 15,
 * where the estimator got 3 and 3 (so it is not asked for these).
 */
export function spelledOut(spelling: string): string[] | undefined {
  const m = /^([b-df-hj-np-tv-xz]{2,8})('s)?$/.exec(spelling);
  if (!m) return undefined;
  const phones = [...m[1]].flatMap((c) => LETTER_NAMES[c]);
  return m[2] ? [...phones, 'Z'] : phones;
}

/**
 * Estimates the pronunciation of a lower-case word the dictionary does not list. Morphology on
 * listed stems is tried first (suffixes such as -s, -ed, -ing, -er, -ly, -ness, -ful, -less, then
 * compounds of two listed words). A listed stem with plural or possessive endings is taken as it
 * is. Any other analysis joins the trained estimator's proposals, weighted (g2p/estimator.ts
 * PRIOR_BONUS), and is used when it comes first: with each development word hidden from the
 * lookup, taking every analysis as it is gave phones exact 70.20 % and syllables exact 96.83 %,
 * where the estimator alone gave 74.58 % and 97.36 % (most of the loss was compounds: "alessandra"
 * is not "ales" + "sandra"). Plurals of listed stems were the analyses that beat the estimator
 * (1,199 of 1,289 phones exact against 1,140). Without a model: morphology, then the NRL
 * letter-to-sound rules. Phones are CMU ARPAbet with stress digits; for an input with no letters,
 * `phones` is empty.
 */
export function estimatePronunciation(word: string, data: WordData): Estimate {
  const lower = word.toLowerCase();
  const hiatus = hiatusOf(lower);
  const kept = (hiatus?.plain ?? lower).replace(/[^a-z']/g, '');
  // Apostrophes alone are no word: nothing is estimated (the model would read "'" as 's).
  const spelling = /[a-z]/.test(kept) ? kept : '';
  // Vowels marked to be said apart (core/hiatus.ts): the estimator reads the word with them
  // apart; no stem or compound of listed words is looked for.
  if (hiatus !== null && kept.length === hiatus.plain.length) {
    const apart = data.estimate?.(spelling, ALTERNATIVES, undefined, hiatus.at);
    if (apart !== undefined && apart.length > 0) return { phones: apart[0].phones, source: 'estimate', how: HIATUS_HOW, alternatives: apart };
    return { phones: letterToSound(spelling), source: 'estimate', how: 'letter-to-sound rules', alternatives: [] };
  }
  const found = spelling.length >= 4 ? analyzeWord(spelling, data, 1) : undefined;
  const letters = found === undefined ? spelledOut(spelling) : undefined;
  if (letters) return { phones: letters, source: 'estimate', how: SPELLED_HOW, alternatives: [] };
  const candidates = spelling && !found?.settled ? data.estimate?.(spelling, ALTERNATIVES, found?.phones) : undefined;
  const morphology = (alternatives: Candidate[]): Estimate => ({
    phones: found!.phones,
    source: 'morphology',
    how: found!.how.startsWith("'") ? `stem ${found!.how}` : found!.how,
    alternatives,
  });
  if (candidates !== undefined && candidates.length > 0) {
    if (found !== undefined && candidates[0].phones.join(' ') === found.phones.join(' ')) return morphology(candidates);
    return { phones: candidates[0].phones, source: 'estimate', how: ESTIMATOR_HOW, alternatives: candidates };
  }
  if (found !== undefined) return morphology([]);
  return { phones: letterToSound(spelling), source: 'estimate', how: 'letter-to-sound rules', alternatives: [] };
}
