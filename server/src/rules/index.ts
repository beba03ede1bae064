// The rule registry and the one entry point both the CLI and the language server call.
import type { Finding, FindingKind } from '../core/findings';
import type { Analysis, Problem, RungAnalysis } from '../core/types';
import { splitLines } from '../core/parse';
import { pushAll } from '../core/arrays';
import { badConfig } from './badConfig';
import { badDirective } from './badDirective';
import { badValue } from './badValue';
import { badRecord } from './badRecord';
import { badVariant } from './badVariant';
import { isAllowed, readDirectives } from './directives';
import { duplicateItem } from './duplicateItem';
import { duplicateRecord } from './duplicateRecord';
import { estimatedWord } from './estimatedWord';
import { internalError, internalFailure } from './internalError';
import { itemOutlier } from './itemOutlier';
import { itemTooLong } from './itemTooLong';
import { overLimit } from './overLimit';
import { paceAboveNorm } from './paceAboveNorm';
import { paceBelowBaseline } from './paceBelowBaseline';
import { paceSlowsDown } from './paceSlowsDown';
import { recordsHeader } from './recordsHeader';
import { recordsSyntax } from './recordsSyntax';
import { rungsOverlap } from './rungsOverlap';
import { silentItem } from './silentItem';
import { smallSet } from './smallSet';
import { stepBackwards } from './stepBackwards';
import { stepTooBig } from './stepTooBig';
import { thinRung } from './thinRung';
import type { LintSettings, Report, Rule, RuleContext } from './types';
import { eolOf } from './shared';
import { unevenSteps } from './unevenSteps';
import { unknownKey } from './unknownKey';
import { unknownPhone } from './unknownPhone';
import { unmatchedSets } from './unmatchedSets';
import { unsortedRung } from './unsortedRung';
import { unusedOverride } from './unusedOverride';

/** Every rule, in documentation order: ladder, items, paces, the format itself, then rate records. */
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
  overLimit,
  internalError,
  badRecord,
  recordsHeader,
  duplicateRecord,
  recordsSyntax,
];

export const RULE_IDS: string[] = RULES.map((r) => r.id);

/**
 * The rules that judge a step between neighbouring rungs. Other ladder rules (a thin or unsorted
 * rung) are about one rung and are listed with its problems, not drawn on a step.
 */
export const STEP_RULES: string[] = [stepBackwards.id, stepTooBig.id, unevenSteps.id, rungsOverlap.id];

/** The rules built from findings; the compiler checks below that every kind has one of them. */
const FINDING_RULES = [unknownKey, badValue, unknownPhone, badVariant, badConfig, overLimit, internalError, badRecord, recordsHeader, duplicateRecord, recordsSyntax] as const;
type Unowned = Exclude<FindingKind, (typeof FINDING_RULES)[number]['kinds'][number]>;
export const EVERY_KIND_OWNED: [Unowned] extends [never] ? true : never = true;

/** The rule that renders each finding kind; a kind claimed by two rules is a mistake caught here. */
export const OWNER = new Map<FindingKind, Rule>();
for (const r of RULES) {
  for (const k of r.kinds ?? []) {
    if (OWNER.has(k)) throw new Error(`finding kind "${k}" is claimed by ${OWNER.get(k)!.id} and ${r.id}`);
    OWNER.set(k, r);
  }
}

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

/** True when a problem's range lies within the script's lines. */
function inside(lines: string[], p: Problem): boolean {
  const ok = (line: number, ch: number) => line >= 0 && line < lines.length && ch >= 0 && ch <= lines[line].length;
  return ok(p.line, p.character) && ok(p.endLine, p.endCharacter) && (p.line < p.endLine || (p.line === p.endLine && p.character <= p.endCharacter));
}

/** Words findings outside a script (config and lexicon files) with the rules that own their kinds. */
export function renderFindings(findings: Finding[]): Problem[] {
  return findings.map((f) => {
    const rule = OWNER.get(f.kind);
    if (!rule?.describe) throw new Error(`no rule renders "${f.kind}" findings`);
    const { line, character, endLine, endCharacter } = f;
    const d = rule.describe(f);
    return { line, character, endLine, endCharacter, rule: rule.id, ...d, severity: d.severity ?? rule.defaultSeverity };
  });
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
 * One rung's reports from every rung-local rule, sorted, kept with the rung's analysis while the
 * rules' reports on it are the same lists: an edit sorts the problems of the rungs it touched.
 */
const sortedByRung = new WeakMap<RungAnalysis, { parts: Problem[][]; sorted: Problem[] }>();

function sortedRungReports(r: RungAnalysis, parts: Problem[][]): Problem[] {
  const hit = sortedByRung.get(r);
  if (hit && hit.parts.length === parts.length && hit.parts.every((p, i) => p === parts[i])) return hit.sorted;
  const sorted: Problem[] = [];
  for (const p of parts) pushAll(sorted, p);
  sorted.sort(compareProblems);
  sortedByRung.set(r, { parts, sorted });
  return sorted;
}

function isSorted(ps: Problem[]): boolean {
  for (let i = 1; i < ps.length; i++) if (compareProblems(ps[i - 1], ps[i]) > 0) return false;
  return true;
}

/** Two sorted lists as one; on a tie the first list's problem goes first. */
function mergeSorted(a: Problem[], b: Problem[]): Problem[] {
  if (!b.length) return a;
  if (!a.length) return b;
  const out: Problem[] = new Array(a.length + b.length);
  let i = 0;
  let j = 0;
  let k = 0;
  while (i < a.length && j < b.length) out[k++] = compareProblems(b[j], a[i]) < 0 ? b[j++] : a[i++];
  while (i < a.length) out[k++] = a[i++];
  while (j < b.length) out[k++] = b[j++];
  return out;
}

/**
 * The problem a rule's report becomes, the same object for the same report: a rule that keeps
 * its reports between analyses (duplicate-item) then yields problems the server converted before.
 */
const wrapped = new WeakMap<object, Problem>();

function wrap(rule: Rule, p: Parameters<Report>[0]): Problem {
  const hit = wrapped.get(p);
  if (hit && hit.rule === rule.id) return hit;
  const out = { ...p, rule: rule.id, severity: p.severity ?? rule.defaultSeverity };
  wrapped.set(p, out);
  return out;
}

/**
 * All problems of an analysed script: the core's own (syntax, settings, phones) and every rule's,
 * with ignore directives and severity overrides applied, sorted by position. Rung-local rules'
 * problems come sorted per rung (kept with each rung's analysis) and are merged with the rest,
 * so an edit sorts only what it changed.
 */
export function lint(
  analysis: Analysis,
  text: string,
  settings: LintSettings = { severities: {} },
  /** The text's lines when the caller has them already (the language server's snapshot). */
  lines: string[] = splitLines(text),
): Problem[] {
  const global: Problem[] = [];
  // Per rung, the reports of each rung-local rule that ran cleanly.
  const rungParts: Problem[][][] = analysis.rungs.map(() => []);
  // A copy: failures caught below are added for internal-error, which runs last.
  const ctx: RuleContext = { analysis, lines, text, settings, findings: [...analysis.findings], ruleIds: RULE_IDS };
  for (const rule of RULES) {
    // The registry boundary: a rule that throws, or reports outside the script, becomes one
    // internal-error problem and the other rules still run.
    try {
      if (rule.checkRung) {
        const mine = analysis.rungs.map((r) => rungReports(ctx, rule, r));
        for (const part of mine) {
          const outside = part.find((p) => !inside(lines, p));
          if (outside) throw outsideError(outside);
        }
        mine.forEach((part, k) => part.length && rungParts[k].push(part));
        continue;
      }
      const mine: Problem[] = [];
      rule.check(ctx, (p) => mine.push(wrap(rule, p)));
      const outside = mine.find((p) => !inside(lines, p));
      if (outside) throw outsideError(outside);
      pushAll(global, mine);
    } catch (err) {
      ctx.findings.push(internalFailure(rule.id, err));
    }
  }
  let local: Problem[] = [];
  analysis.rungs.forEach((r, k) => pushAll(local, sortedRungReports(r, rungParts[k])));
  // Rung-local rules report inside their rung, so the rungs' lists follow each other in order;
  // a rule that reports elsewhere only costs a full sort.
  if (!isSorted(local)) local = local.sort(compareProblems);
  const all = mergeSorted(local, global.sort(compareProblems));
  const directives = readDirectives(analysis.script.comments, lines, RULE_IDS, badDirective.id);
  const out: Problem[] = [];
  const overrides = Object.keys(settings.severities).length > 0;
  const silenced = directives.file.size > 0 || directives.lines.size > 0;
  for (const p of all) {
    if (silenced && isAllowed(directives, p)) continue;
    if (p.fix === undefined) delete p.fix;
    const o = overrides ? settings.severities[p.rule] : undefined;
    if (o === 'off') continue;
    out.push(o ? { ...p, severity: o } : p);
  }
  return out;
}

function outsideError(p: Problem): Error {
  return new Error(`reported a position outside the script (line ${p.line + 1}, column ${p.character + 1})`);
}
