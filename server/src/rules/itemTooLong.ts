// item-too-long: an item over the script's word, syllable or phoneme limit.
import { eachRung, type Rule } from './types';
import { itemRange, rungLabel } from './shared';

export const itemTooLong: Rule = {
  id: 'item-too-long',
  summary: 'An item has more words, syllables or phonemes than `@max-words`, `@max-syllables` or `@max-phonemes`.',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'Scripts for clients with non-fluent aphasia often cap item length. With `@max-words`,',
    '`@max-syllables` or `@max-phonemes` set above 0 (in the script header or a config file), every',
    'item over a limit is reported with its count and the limit. Words are spoken words after',
    'expansion (numbers, times and abbreviations are spelt out; each part of a hyphenated compound',
    'counts); syllables and phonemes come from the pronunciations (a phoneme is one ARPAbet phone).',
    'Fix it by shortening or splitting the item.',
  ].join(' '),
  ...eachRung((ctx, r, report) => {
    const { maxWords, maxSyllables, maxPhonemes } = ctx.analysis.options;
    for (const it of r.items) {
      const over: string[] = [];
      if (maxWords > 0 && it.wordCount > maxWords) over.push(`${it.wordCount} words, over the limit of ${maxWords} (@max-words)`);
      if (maxSyllables > 0 && it.syllables > maxSyllables) {
        over.push(`${it.syllables} syllables, over the limit of ${maxSyllables} (@max-syllables)`);
      }
      if (maxPhonemes > 0 && it.phonemes > maxPhonemes) over.push(`${it.phonemes} phonemes, over the limit of ${maxPhonemes} (@max-phonemes)`);
      if (!over.length) continue;
      report({
        ...itemRange(it),
        message: `item in ${rungLabel(ctx.analysis.rungs[it.rung])} has ${over.join(' and ')}`,
      });
    }
  }),
};
