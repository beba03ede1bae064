// internal-error: a rule (or the analysis) failed on this script. Rungs reports the failure as one
// problem instead of stopping, so every other rule's problems are still shown.
import { finding } from '../core/findings';
import type { Problem } from '../core/types';
import { findingRule } from './findingRule';

export const internalError = findingRule(
  {
    id: 'internal-error',
    summary: 'Rungs itself failed on part of this script; the other checks still ran.',
    defaultSeverity: 'error',
    category: 'format',
    docs: [
      'A rule that throws, or reports a position outside the script, is caught where the rules are',
      'run and becomes this one problem (at the start of the script, naming the rule and the error);',
      'the language server reports an analysis that fails the same way. It is a fault in Rungs, not',
      'in the script: please report it with the script that shows it. Every other rule still runs.',
    ].join(' '),
  },
  ['internal-failure'],
  (f) => ({
    message:
      f.rule === null
        ? `Rungs could not analyse this script (${f.error}); see the Rungs output for details`
        : `rule ${f.rule} failed on this script: ${f.error}`,
  }),
);

const START = { line: 0, character: 0, endLine: 0, endCharacter: 0 };

/** The finding for a failure at the start of the script: of a rule, or (rule null) of the analysis. */
export const internalFailure = (rule: string | null, err: unknown) =>
  finding(START, { kind: 'internal-failure', rule, error: err instanceof Error ? err.message : String(err) });

/** The problem the language server shows when a whole analysis failed. */
export function analysisFailed(err: unknown): Problem {
  return { ...START, rule: internalError.id, severity: internalError.defaultSeverity, ...internalError.describe!(internalFailure(null, err)) };
}
