// records-header: the header row of a rate-records file. The records core reads the header
// (server/src/core/records/validate.ts); this file words what it found.
import type { Described } from './types';
import { findingRule } from './findingRule';

export const recordsHeader = findingRule(
  {
    id: 'records-header',
    summary: 'The header row of a rate-records file lacks a required column, repeats one, or names one Rungs does not read.',
    defaultSeverity: 'error',
    category: 'records',
    docs: [
      'The first non-blank row of a records file names its columns (case-insensitive, in any order).',
      'The columns date, client, condition, words and seconds are required (script and rung may be',
      'left out of a file of unassisted samples only); a missing one is an error on the header. A',
      'column named twice is an error on the second: the first one is read. A column Rungs does not',
      'know is a warning: it stays in the file (a spreadsheet may keep its own notes) but is not read;',
      'the message lists the columns Rungs reads, so a misspelt name is easy to spot.',
    ].join(' '),
  },
  ['record-missing-column', 'record-repeated-column', 'record-unknown-column'],
  (f): Described => {
    switch (f.kind) {
      case 'record-missing-column':
        return { message: `the header has no "${f.column}" column` };
      case 'record-repeated-column':
        return { message: `column "${f.name}" appears twice; the first one is read` };
      case 'record-unknown-column':
        return { message: `unknown column "${f.name}": it is kept in the file but not read (columns: ${f.known.join(', ')})`, severity: 'warning' };
    }
  },
);
