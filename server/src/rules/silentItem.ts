// silent-item: an item line with nothing in it to say (only punctuation or symbols).
import { eachRung, type Rule } from './types';
import { itemRange } from './shared';

export const silentItem: Rule = {
  id: 'silent-item',
  summary: 'An item has no words to say (only punctuation or symbols).',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'An item line whose text yields no spoken words, such as `...` or `!!! ???`, has 0 words,',
    '0 syllables and a duration of 0 seconds at every pace, yet it is still an item: it counts',
    "towards its rung's item count and median, and is ranked with the others. Words are counted",
    'after expansion, so digits, times and abbreviations (`3`, `10:30`, `Dr.`) are words and an',
    'item made of them is not silent. A placeholder or a stage direction written as an item is',
    'reported here; write the sentence, turn the line into a `//` comment, or delete it.',
  ].join(' '),
  ...eachRung((ctx, r, report) => {
    for (const it of r.items) {
      if (it.wordCount !== 0) continue;
      report({ ...itemRange(it), message: 'this item has no words to say (0 words)' });
    }
  }),
};
