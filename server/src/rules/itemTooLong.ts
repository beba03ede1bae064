// item-too-long: an item over the script's word or syllable limit.
import { eachRung, type Rule } from './types';
import { itemRange, rungLabel } from './shared';

export const itemTooLong: Rule = {
  id: 'item-too-long',
  summary: 'An item has more words than `@max-words` or more syllables than `@max-syllables`.',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'Scripts for clients with non-fluent aphasia often cap item length. With `@max-words` or',
    '`@max-syllables` set above 0 (in the script header or a config file), every item over a limit',
    'is reported with its count and the limit. Words are spoken words after expansion (numbers,',
    'times and abbreviations are spelt out; each part of a hyphenated compound counts), syllables',
    'come from the pronunciations. Fix it by shortening or splitting the item.',
  ].join(' '),
  ...eachRung((ctx, r, report) => {
    const { maxWords, maxSyllables } = ctx.analysis.options;
    for (const it of r.items) {
      const over: string[] = [];
      if (maxWords > 0 && it.wordCount > maxWords) over.push(`${it.wordCount} words, over the limit of ${maxWords} (@max-words)`);
      if (maxSyllables > 0 && it.syllables > maxSyllables) {
        over.push(`${it.syllables} syllables, over the limit of ${maxSyllables} (@max-syllables)`);
      }
      if (!over.length) continue;
      report({
        ...itemRange(it),
        message: `item in ${rungLabel(ctx.analysis.rungs[it.rung])} has ${over.join(' and ')}`,
      });
    }
  }),
};
