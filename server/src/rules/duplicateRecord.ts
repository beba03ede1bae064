// duplicate-record: a rate-records row equal, cell for cell, to an earlier row of the same file.
// The records core finds it (server/src/core/records/validate.ts); this file words it.
import type { Described } from './types';
import { findingRule } from './findingRule';

export const duplicateRecord = findingRule(
  {
    id: 'duplicate-record',
    summary: 'A rate-records row repeats an earlier row of the same file cell for cell; it is counted once.',
    defaultSeverity: 'error',
    category: 'records',
    docs: [
      'A row whose cells (trimmed) are all equal to those of an earlier row is almost always a',
      'measurement pasted twice. Counting it twice would weigh that session double in the pooled',
      'unassisted rate and in the trend, so the later copy is left out and reported on its whole',
      'line, naming the line of the first one. Two real measurements of the same day differ in at',
      'least one cell (seconds, words, a task or a note): add a note to keep both.',
    ].join(' '),
  },
  ['record-duplicate-row'],
  (f): Described => ({ message: `this row repeats line ${f.earlierLine + 1}; it is counted once` }),
);
