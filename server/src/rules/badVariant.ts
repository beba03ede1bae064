// bad-variant: a pronunciation number that the dictionary does not list for the word.
// The core reports it while pronouncing, where the listed pronunciations are at hand; this file
// holds the rule's metadata and docs, so the id has a docs page and a severity setting.
import type { Rule } from './types';

export const badVariant: Rule = {
  id: 'bad-variant',
  summary: 'A `word(N)` mark or `@say word = N` picks a pronunciation the dictionary does not list.',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'Heteronyms such as *record* or *read* have more than one listed pronunciation, chosen by',
    'number: `record(2)` for one occurrence, `@say record = 2` for the whole script. A number above',
    'the count of listed pronunciations, or a number on a word the dictionary does not hold, is',
    'reported with the count; the first listed pronunciation (or the estimate) is used instead.',
    'The hover on a word lists its pronunciations with their numbers.',
  ].join(' '),
  // Reported by the core while pronouncing items and reading overrides (core/analyze.ts).
  check() {},
};
