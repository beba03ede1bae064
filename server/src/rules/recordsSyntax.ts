// records-syntax: a rate-records row the CSV parser (csv-parse) cannot read. The records core
// reads the file (server/src/core/records/csv.ts); this file words the parser's account.
import type { Described } from './types';
import { findingRule } from './findingRule';

export const recordsSyntax = findingRule(
  {
    id: 'records-syntax',
    summary: 'A row of a rate-records file cannot be read as CSV (for example a quote that is never closed).',
    defaultSeverity: 'error',
    category: 'records',
    docs: [
      'Records files are CSV with a comma, semicolon or tab between cells (detected from the header),',
      'quoted cells where a value holds the delimiter, a quote or a line break (a quote inside a quoted',
      'cell is written twice), an optional UTF-8 byte-order mark and LF or CRLF line ends. A row the',
      'parser cannot read is reported on its line with the parser\'s explanation and left out; the',
      'rows around it are still read. After a quote that is never closed the parser cannot find where',
      'the row ends, so the rest of the file may be left out: close the quote.',
    ].join(' '),
  },
  ['record-syntax'],
  (f): Described => ({ message: `this row cannot be read as CSV: ${f.explanation}` }),
);
