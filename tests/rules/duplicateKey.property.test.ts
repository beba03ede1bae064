// Property: duplicate-item's quick key for plain ASCII items gives exactly the key of the general
// rule (lower case, typographic apostrophes as "'", every run of characters other than letters,
// digits, ' ( ) as one space, trimmed) on arbitrary text. The reference is the rule's own general
// key, so any difference is a fault of the quick path.
import { fc, test } from '@fast-check/vitest';
import { expect } from 'vitest';
import { generalSpokenKey, spokenKey } from '../../server/src/rules/duplicateItem';

const FRAGMENTS = [
  ' ', '  ', '\t', '.', ',', '!', '?', "'", '\u2019', '-', '(', ')', '(2)', '"', '\u00a0', '\u2014', 'a', 'I', 'Come', 'in', 'COME',
  'IN', 'the', "don't", '3', '10', '3:30', 'caf\u00e9', '\u00c9t\u00e9', '\u03b1', '_', '#', '@', '\n', '\r',
];
const fragmentText = fc.array(fc.constantFrom(...FRAGMENTS), { maxLength: 16 }).map((xs) => xs.join(''));

test.prop([fc.oneof(fragmentText, fc.string({ maxLength: 30 }), fc.string({ unit: 'grapheme-ascii', maxLength: 30 }))], { numRuns: 3000 })(
  'the plain-item key agrees with the general key',
  (text) => {
    expect(spokenKey(text)).toBe(generalSpokenKey(text));
  },
);
