// bad-record: a cell of a rate-records row that cannot be used. The records core finds it
// (server/src/core/records/validate.ts, one check per column); this file words it.
import type { EmptyCellReason, RecordCellProblem } from '../core/findings';
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
  // Each message names the column, the value and what the column takes.
  (f): Described => ({ message: cellMessage(f.column, f.value, f.problem) }),
);

const EMPTY_REASON: Record<EmptyCellReason, string> = {
  'condition-choices': ': write unassisted or paced',
  'no-transcript': ' and there is no transcript to count',
  'paced-needs-script': ': a paced row names the script it practised',
  'paced-needs-rung': ': a paced row names the rung it practised (name or number)',
};

function cellMessage(column: string, value: string, p: RecordCellProblem): string {
  switch (p.what) {
    case 'empty':
      return `${column} is empty${p.why ? EMPTY_REASON[p.why] : ''}`;
    case 'not-iso-date':
      return `"${value}" is not an ISO 8601 date: write YYYY-MM-DD, e.g. 2026-03-02`;
    case 'not-in-calendar':
      return `${value} is not a date of the calendar`;
    case 'in-future':
      return `${value} is in the future (today is ${p.today})`;
    case 'unknown-condition':
      return `unknown condition "${value}": write unassisted or paced`;
    case 'not-a-number':
      return column === 'words' ? `words must be a whole number, not "${value}"` : `${column} must be a number, not "${value}"`;
    case 'not-above-zero':
      return `${column} must be above 0, not ${value}`;
    case 'not-a-count':
      return column === 'correct' ? `correct must be a whole number, 0 or more, not "${value}"` : `${column} must be a whole number, 0 or more, not ${value}`;
    case 'implausible-rate':
      return `${p.words} words in ${p.seconds} s is ${p.rate.toFixed(1)} words/s, faster than any plausible speech (${p.limit} words/s): check both numbers`;
    case 'more-correct-than-words':
      return `${value} correct words is more than the ${p.words} words of the row`;
    case 'no-such-script':
      return `no script "${value}" (the path is relative to this records file)`;
    case 'no-such-rung': {
      const names = p.rungs.map((r, i) => `${i + 1} "${r}"`).join(', ');
      return `"${p.script}" has no rung "${value}" (its rungs: ${names || 'none'})`;
    }
    case 'unreadable-pace':
      return p.explanation;
    case 'not-one-pace':
      return `give one pace, not ${p.count}`;
    case 'rung-without-pace':
      return 'the rung has no pace and the row gives none';
    case 'no-pace':
      return 'no pace: give one in the pace column, or a script and rung that set one';
  }
}
