// Properties of duplicate-item's quick paths, each against the rule's general definition (no
// accents on Latin letters, lower case, typographic apostrophes as "'", every run of characters
// other than letters, digits, ' ( ) as one space, trimmed), so any difference is a fault of a
// quick path:
// - the plain-item key equals the general key on arbitrary text;
// - the key number is FNV-1a of the general key (32-bit offset basis 2166136261, prime 16777619,
//   the published FNV parameters, from memory), cut to 30 bits, and -1 exactly for an empty key;
// - the rule reports exactly the repeats a plain grouping by general key finds, first line named.
import { fc, test } from '@fast-check/vitest';
import { expect } from 'vitest';
import { duplicateItem } from '../../server/src/rules/duplicateItem';
import { generalSpokenKey, keyHash, spokenKey } from '../../server/src/rules/itemKey';
import type { Problem } from '../../server/src/core/types';
import type { RuleContext } from '../../server/src/rules/types';
import { analyzeText } from '../helpers/data';
import { plainRepeats } from '../helpers/repeats';

const FRAGMENTS = [
  ' ', '  ', '\t', '.', ',', '!', '?', "'", '\u2019', '-', '(', ')', '(2)', '"', '\u00a0', '\u2014', 'a', 'I', 'Come', 'in', 'COME',
  'IN', 'the', "don't", '3', '10', '3:30', 'caf\u00e9', '\u00c9t\u00e9', '\u03b1', '_', '#', '@', '\n', '\r',
];
const fragmentText = fc.array(fc.constantFrom(...FRAGMENTS), { maxLength: 16 }).map((xs) => xs.join(''));
const anyText = fc.oneof(fragmentText, fc.string({ maxLength: 30 }), fc.string({ unit: 'grapheme-ascii', maxLength: 30 }));

function fnv30(key: string): number {
  let h = 2166136261;
  for (let i = 0; i < key.length; i++) h = Math.imul(h ^ key.charCodeAt(i), 16777619);
  return h & 0x3fffffff;
}

test.prop([anyText], { numRuns: 3000 })('the plain-item key agrees with the general key', (text) => {
  expect(spokenKey(text)).toBe(generalSpokenKey(text));
});

test.prop([anyText], { numRuns: 3000 })('the key number is FNV-1a of the general key, -1 when it is empty', (text) => {
  const key = generalSpokenKey(text);
  expect(keyHash(text)).toBe(key === '' ? -1 : fnv30(key));
});

// Items drawn from a few sentences written with different case, punctuation and accents, so
// repeats are common.
const ITEMS = ['Come in.', 'come in!', 'COME IN', 'Come in, please.', 'Sit down.', 'sit  down', 'Good morning.', "Don't go.", 'don\u2019t go', '(Wave.)', 'Café au lait.', 'cafe au lait', 'CAFE\u0301 AU LAIT!', 'Καλημέρα.', 'καλημερα'];

test.prop([fc.array(fc.constantFrom(...ITEMS), { minLength: 1, maxLength: 30 })], { numRuns: 300 })(
  'the rule reports the repeats a grouping by general key finds',
  (lines) => {
    const text = `${lines.join('\n')}\n`;
    const analysis = analyzeText(text);
    const found: Problem[] = [];
    const ctx = { analysis, lines: text.split('\n'), text, settings: { severities: {} }, findings: [], ruleIds: [] } as unknown as RuleContext;
    duplicateItem.check(ctx, (p) => found.push(p as Problem));
    expect(found.map((p) => [p.line, p.related![0].line])).toEqual(plainRepeats(analysis.items));
  },
);

// "word ngwk" and "word nuaab" are different keys with the same key number (found by a search,
// computed with fnv30 above), so the rule must tell them apart by their keys.
test('items whose key numbers meet are told apart by their keys', () => {
  expect(keyHash('Word ngwk.')).toBe(keyHash('word nuaab'));
  const text = 'Word ngwk.\nword nuaab\nword ngwk\nWord nuaab!\nword ngwk\n';
  const analysis = analyzeText(text);
  const found: Problem[] = [];
  const ctx = { analysis, lines: text.split('\n'), text, settings: { severities: {} }, findings: [], ruleIds: [] } as unknown as RuleContext;
  duplicateItem.check(ctx, (p) => found.push(p as Problem));
  expect(found.map((p) => [p.line, p.related![0].line])).toEqual([[2, 0], [3, 1], [4, 0]]);
});
