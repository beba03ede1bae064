// Property: the tokenizer's plain-word fast path (a run of ASCII letters that nothing can join to
// more) gives exactly the tokens of the general word scanner, on arbitrary text. The reference
// is the tokenizer itself with the fast path off, so any difference is a fault of the fast path.
// Fragments are the characters and words where the two could part: abbreviations written with
// and without periods, apostrophes (ASCII and typographic), hyphens, variant marks, initials,
// numbers, times, currency and non-ASCII letters (common practice: the written forms English
// stimulus scripts use).
import { fc, test } from '@fast-check/vitest';
import { expect } from 'vitest';
import { plainItemWords } from '../../server/src/core/plainWords';
import { tokenize, tokenizeWith } from '../../server/src/core/tokenize';

const FRAGMENTS = [
  ' ', '  ', '\t', '.', ',', '!', '?', ';', ':', "'", '\u2019', '\u2018', '-', '\u2010', '\u2212', '(', ')', '(2)', '&', '$', '%',
  '"', '\u2014', '\u2026', 'a', 'I', 'the', 'The', 'THE', 'cat', 'cats', "cats'", "don't", 'Mr', 'Mr.', 'mr', 'Dr', 'Dr.', 'dr',
  'vs', 'Vs', 'VS', 'vs.', 'etc', 'etc.', 'St', 'st', 'Mrs', 'Ms', 'Prof', 'prof', 'Blvd', 'am', 'pm', 'a.m.', 'p.m.', 'U.K.', 'J.',
  'Smith', 'goin', "goin'", 'well', 'read', 'record(2)', 'x', 'X', 'caf\u00e9', 'e\u0301', '\u00fcber', '\u03b1\u03b2', '\u4e2d',
  '3', '10', '3:30', '1st', '2nd', '1,000', '5', '$5', '50%', "'90s", "'n", "'til", 'rock', 'roll', 'COVID', '19', 'okafor',
  'x\u00ad', '\u200d', 'o\u2019clock', 'J. Smith', 'John F. Kennedy', 'e.g.', 'I.', ' A', '. ',
];

const fragmentText = fc.array(fc.constantFrom(...FRAGMENTS), { maxLength: 24 }).map((xs) => xs.join(''));
const anyText = fc.oneof(fragmentText, fc.string({ maxLength: 40 }), fc.string({ unit: 'grapheme', maxLength: 30 }));

test.prop([anyText, fc.nat(200)], { numRuns: 3000 })('the plain-word fast path agrees with the general scanner', (text, offset) => {
  expect(tokenizeWith(text, offset, true)).toEqual(tokenizeWith(text, offset, false));
});

test.prop([fragmentText])('tokenize is the fast path', (text) => {
  expect(tokenize(text, 3)).toEqual(tokenizeWith(text, 3, true));
});

// A plain item's words (read without tokens by the analysis) are exactly its tokens: one word
// token per plain word, its lower case, no variant mark, the same offsets.
test.prop([anyText], { numRuns: 3000 })('a plain item reads as the tokens say', (text) => {
  const plain = plainItemWords(text);
  if (plain === null) return;
  const tokens = tokenizeWith(text, 0, false);
  expect(plain.map((w) => [w.end - w.surface.length, w.end, w.surface, [w.spoken], null, 'word'])).toEqual(
    tokens.map((t) => [t.start, t.end, t.surface, t.words, t.variant, t.kind]),
  );
});

test('the usual item is plain, and items with numbers, marks or abbreviations are not', () => {
  // Computed by reading the tokenizer's rules: these take the general path.
  expect(plainItemWords('My sister bought the bread.')?.map((w) => w.spoken)).toEqual(['my', 'sister', 'bought', 'the', 'bread']);
  for (const text of ['at 3:30', 'with Dr. Patel', "don't", 'read(2)', 'cats & dogs', 'well-read', 'caf\u00e9', 'Mr Smith', 'J. Smith']) {
    expect(plainItemWords(text)).toBeNull();
  }
});
