// Written short forms and the words a reader says for them. These are data, read by tokenize.ts;
// add a row here rather than a branch there. Every spoken word is lower case and is chosen so the
// CMU Pronouncing Dictionary lists it (which is why "Ms." stays "ms": the dictionary has no "miz").

export interface Abbreviation {
  /** Spoken words, lower case. */
  words: readonly string[];
  /** Reading used instead when the next word starts with a capital letter ("St. Paul" -> saint). */
  beforeCapital?: readonly string[];
  /**
   * Also recognised without the period: 'capitalised' only when written with a capital first
   * letter (British "Mr Smith", while lower-case "dr" stays a word), 'any' in any case ("vs").
   */
  bare?: 'capitalised' | 'any';
}

/** Keyed by the lower-case written form including its periods, e.g. "dr.", "e.g.", "u.s.". */
export const ABBREVIATIONS: ReadonlyMap<string, Abbreviation> = new Map<string, Abbreviation>([
  // Titles. Readers never pause after the period of a title.
  ['dr.', { words: ['doctor'], bare: 'capitalised' }],
  ['mr.', { words: ['mister'], bare: 'capitalised' }],
  ['mrs.', { words: ['missus'], bare: 'capitalised' }],
  ['ms.', { words: ['ms'], bare: 'capitalised' }],
  ['prof.', { words: ['professor'], bare: 'capitalised' }],
  ['jr.', { words: ['junior'], bare: 'capitalised' }],
  ['sr.', { words: ['senior'], bare: 'capitalised' }],
  // Places. "St." names a saint before a name ("St. Paul") and a street after one ("Main St.").
  ['st.', { words: ['street'], beforeCapital: ['saint'], bare: 'capitalised' }],
  ['mt.', { words: ['mount'], bare: 'capitalised' }],
  // No undotted "Ave": "Ave Maria" is a prayer, not an avenue.
  ['ave.', { words: ['avenue'] }],
  ['rd.', { words: ['road'], bare: 'capitalised' }],
  ['blvd.', { words: ['boulevard'], bare: 'capitalised' }],
  // Latin and everyday short forms, read as their English expansion.
  ['vs.', { words: ['versus'], bare: 'any' }],
  ['etc.', { words: ['et', 'cetera'], bare: 'any' }],
  ['e.g.', { words: ['for', 'example'] }],
  ['i.e.', { words: ['that', 'is'] }],
  // Initialisms are spelled out letter by letter; other dotted single letters ("U.K.") are too.
  ['a.m.', { words: ['a', 'm'] }],
  ['p.m.', { words: ['p', 'm'] }],
  ['u.s.', { words: ['u', 's'] }],
  ['ph.d.', { words: ['p', 'h', 'd'] }],
  // Said as one dictionary word, like the undotted spelling "TV".
  ['t.v.', { words: ['tv'] }],
]);

/**
 * Words that begin with an apostrophe standing for dropped letters. Anything else after a leading
 * apostrophe is a quotation mark. "'n" (rock 'n' roll) stays "'n": the dictionary lists it with the
 * reduced vowel speakers use, which "and" would not give.
 */
export const LEADING_ELISIONS: ReadonlySet<string> = new Set([
  "'n",
  "'em",
  "'til",
  "'cause",
  "'tis",
  "'twas",
  "'bout",
  "'round",
]);

export interface Currency {
  one: string;
  many: string;
  subunitOne: string;
  subunitMany: string;
}

/** Currency signs written before an amount ("$5", "£2.50"). */
export const CURRENCIES: ReadonlyMap<string, Currency> = new Map<string, Currency>([
  ['$', { one: 'dollar', many: 'dollars', subunitOne: 'cent', subunitMany: 'cents' }],
  ['£', { one: 'pound', many: 'pounds', subunitOne: 'penny', subunitMany: 'pence' }],
  ['€', { one: 'euro', many: 'euros', subunitOne: 'cent', subunitMany: 'cents' }],
]);
