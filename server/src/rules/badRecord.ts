// bad-record: a cell of a rate-records row that cannot be used. The records core finds it
// (server/src/core/records/validate.ts, one check per column); this file words it.
import type { Described } from './types';
import { findingRule } from './findingRule';

export const badRecord = findingRule(
  {
    id: 'bad-record',
    summary: 'A cell of a rate-records row (`*.rates.csv`) cannot be used, so the row is left out of rates, ratios and trends.',
    defaultSeverity: 'error',
    category: 'records',
    docs: [
      'Reported on the cell itself (file, line and column): zero or negative seconds; negative or',
      'fractional words; more correct words than words; a rate above 8 words/s (see the rate-records',
      'section for the source of the bound); a date that is not ISO 8601 (YYYY-MM-DD), does not exist',
      'in the calendar or lies in the future; an empty date, client, condition, seconds or words cell',
      '(words may be left empty when a transcript is given); an unknown condition (write unassisted or',
      'paced); a script that does not exist (the path is relative to the records file) or a rung it',
      'does not have; a paced row without a script and rung, or whose pace cannot be resolved. The row',
      'stays in the file and is left out of the computations; the rest of the file is used. Fix the',
      'cell and the row counts again.',
    ].join(' '),
  },
  ['record-bad-cell'],
  // The core's explanation names the column, the value and what the column takes.
  (f): Described => ({ message: f.explanation }),
);
