// The rule registry and the one entry point both the CLI and the language server call.
import type { Analysis, Problem } from '../core/types';
import { splitLines } from '../core/parse';
import type { LintSettings, Rule } from './types';

/** Every rule, in documentation order. */
export const RULES: Rule[] = [];

/**
 * All problems of an analysed script: the core's own (syntax, settings, phones) and every rule's,
 * with severity overrides and ignore directives applied, sorted by position.
 */
export function lint(analysis: Analysis, text: string, settings: LintSettings = { severities: {} }): Problem[] {
  const problems: Problem[] = [];
  const lines = splitLines(text);
  for (const p of analysis.problems) problems.push(p);
  for (const rule of RULES) {
    rule.check({ analysis, lines }, (p) =>
      problems.push({ ...p, rule: rule.id, severity: p.severity ?? rule.defaultSeverity }),
    );
  }
  const out: Problem[] = [];
  for (const p of problems) {
    const o = settings.severities[p.rule];
    if (o === 'off') continue;
    out.push(o ? { ...p, severity: o } : p);
  }
  return out.sort((a, b) => a.line - b.line || a.character - b.character || a.rule.localeCompare(b.rule));
}
