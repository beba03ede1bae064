// bad-variant: a pronunciation number that the dictionary does not list for the word.
// The core finds it while pronouncing, where the listed pronunciations are at hand; this file
// words it.
import { findingRule } from './findingRule';

export const badVariant = findingRule(
  {
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
  },
  ['variant-not-listed'],
  (f) => ({
    message: f.listed
      ? `"${f.word}" has ${f.listed} listed pronunciation${f.listed === 1 ? '' : 's'}, not ${f.variant}; the first is used`
      : `"${f.word}" is not in the dictionary, so there is no listed pronunciation ${f.variant} to choose; it is estimated`,
  }),
);
