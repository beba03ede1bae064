// over-limit: a line or a whole script larger than the analysis reads (core/limits.ts finds it).
// The rest is checked; the part past the bound is not, and nothing in the file is changed.
import { formatBytes } from '../core/limits';
import { findingRule } from './findingRule';

export const overLimit = findingRule(
  {
    id: 'over-limit',
    summary: 'A line or a script is larger than Rungs analyses; only the part up to the bound is checked.',
    defaultSeverity: 'error',
    category: 'format',
    docs: [
      'Rungs analyses at most 10,000 characters of a line and 32 MiB of a script, so a pasted blob',
      'or a huge file never stalls the editor or CI. A longer line is analysed up to its',
      '10,000th character and reported where the unread part starts; in a larger script the whole',
      'lines up to 32 MiB are analysed and the problem is on the first line not read. Nothing is',
      'rewritten: while any part is over a bound, no fix is offered for the script (a fix made',
      'from a part could drop the rest). Split the line or the script to have all of it checked.',
    ].join(' '),
  },
  ['line-over-limit', 'script-over-limit'],
  (f) =>
    f.kind === 'line-over-limit'
      ? { message: `this line has ${f.length} characters; only the first ${f.limit} are checked` }
      : { message: `the script is larger than ${formatBytes(f.limit)}: checked up to line ${f.checkedLines} only` },
);
