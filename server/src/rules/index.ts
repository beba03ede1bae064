// The rule registry and the one entry point both the CLI and the language server call.
import type { Analysis, Problem, RungAnalysis } from '../core/types';
import { splitLines } from '../core/parse';
import { badConfig } from './badConfig';
import { badDirective } from './badDirective';
import { badValue } from './badValue';
import { badVariant } from './badVariant';
import { isAllowed, readDirectives } from './directives';
import { duplicateItem } from './duplicateItem';
import { estimatedWord } from './estimatedWord';
import { itemOutlier } from './itemOutlier';
import { itemTooLong } from './itemTooLong';
import { paceAboveNorm } from './paceAboveNorm';
import { paceBelowBaseline } from './paceBelowBaseline';
import { paceSlowsDown } from './paceSlowsDown';
import { rungsOverlap } from './rungsOverlap';
import { silentItem } from './silentItem';
import { smallSet } from './smallSet';
import { stepBackwards } from './stepBackwards';
import { stepTooBig } from './stepTooBig';
import { thinRung } from './thinRung';
import type { LintSettings, Rule, RuleContext } from './types';
import { eolOf } from './shared';
import { unevenSteps } from './unevenSteps';
import { unknownKey } from './unknownKey';
import { unknownPhone } from './unknownPhone';
import { unmatchedSets } from './unmatchedSets';
import { unsortedRung } from './unsortedRung';
import { unusedOverride } from './unusedOverride';

/** Every rule, in documentation order: ladder, items, paces, then the format itself. */
export const RULES: Rule[] = [
  stepBackwards,
  stepTooBig,
  unevenSteps,
  rungsOverlap,
  thinRung,
  unsortedRung,
  unmatchedSets,
  smallSet,
  itemOutlier,
  duplicateItem,
  silentItem,
  itemTooLong,
  estimatedWord,
  unknownPhone,
  badVariant,
  paceSlowsDown,
  paceAboveNorm,
  paceBelowBaseline,
  unknownKey,
  badValue,
  unusedOverride,
  badConfig,
  badDirective,
];

export const RULE_IDS: string[] = RULES.map((r) => r.id);

export function ruleById(id: string): Rule | undefined {
  return RULES.find((r) => r.id === id);
}

/** Problems in the order every output uses: by position, then rule id, then message. */
export function compareProblems(a: Problem, b: Problem): number {
  return (
    a.line - b.line ||
    a.character - b.character ||
    (a.rule < b.rule ? -1 : a.rule > b.rule ? 1 : 0) ||
    (a.message < b.message ? -1 : a.message > b.message ? 1 : 0)
  );
}

/**
 * A rung-local rule's reports on one rung, kept with the rung's analysis: the incremental path
 * hands back the same analysis object for every rung an edit did not touch, so those rungs are
 * not checked again. The key holds what else the reports read (the lint settings, line endings).
 */
const byRung = new WeakMap<RungAnalysis, Map<string, Problem[]>>();

function rungReports(ctx: RuleContext, rule: Rule, r: RungAnalysis): Problem[] {
  let m = byRung.get(r);
  if (!m) byRung.set(r, (m = new Map()));
  const key = `${rule.id}|${eolOf(ctx)}|${JSON.stringify(ctx.settings.ladder ?? null)}`;
  let out = m.get(key);
  if (!out) {
    const found: Problem[] = [];
    rule.checkRung!(ctx, r, (p) => found.push({ ...p, rule: rule.id, severity: p.severity ?? rule.defaultSeverity }));
    m.set(key, (out = found));
  }
  return out;
}

/**
 * All problems of an analysed script: the core's own (syntax, settings, phones) and every rule's,
 * with ignore directives and severity overrides applied, sorted by position.
 */
export function lint(
  analysis: Analysis,
  text: string,
  settings: LintSettings = { severities: {} },
  /** The text's lines when the caller has them already (the language server's snapshot). */
  lines: string[] = splitLines(text),
): Problem[] {
  const problems: Problem[] = [];
  for (const p of analysis.problems) problems.push(p);
  const ctx = { analysis, lines, text, settings };
  for (const rule of RULES) {
    if (rule.checkRung) {
      for (const r of analysis.rungs) for (const p of rungReports(ctx, rule, r)) problems.push(p);
      continue;
    }
    rule.check(ctx, (p) => problems.push({ ...p, rule: rule.id, severity: p.severity ?? rule.defaultSeverity }));
  }
  const directives = readDirectives(analysis.script.comments, lines, RULE_IDS);
  const out: Problem[] = [];
  for (const p of [...problems.filter((q) => !isAllowed(directives, q)), ...directives.problems]) {
    if (p.fix === undefined) delete p.fix;
    const o = settings.severities[p.rule];
    if (o === 'off') continue;
    out.push(o ? { ...p, severity: o } : p);
  }
  return out.sort(compareProblems);
}
