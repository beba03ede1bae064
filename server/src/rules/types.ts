// The shape every ladder/quality rule shares. One rule per file, metadata first; the id is the
// join key everywhere (LSP diagnostic code and docs link, SARIF ruleId, JSON output, settings).
import type { Finding, FindingKind } from '../core/findings';
import type { Analysis, Fix, Problem, RelatedInfo, RungAnalysis, Severity } from '../core/types';

export interface RuleContext {
  analysis: Analysis;
  /** The script's lines, for rules that build fixes from the original text. */
  lines: string[];
  /** The whole text (line breaks included), for fixes that must keep the file's line endings. */
  text: string;
  /** Lint settings in force (ladder metric and thresholds); severities are applied by lint(). */
  settings: LintSettings;
  /**
   * What the core could not read (the analysis's findings), plus failures of earlier rules caught
   * at the registry boundary. A rule renders the kinds it owns (`Rule.kinds`).
   */
  findings: Finding[];
  /** Every registered rule id (directives name them). */
  ruleIds: readonly string[];
}

/** A finding turned into words: the rule adds its id and the finding's range. */
export interface Described {
  message: string;
  severity?: Severity;
  fix?: Fix;
}

export interface Report {
  (p: {
    line: number;
    character: number;
    endLine: number;
    endCharacter: number;
    message: string;
    related?: RelatedInfo[];
    fix?: Fix;
    unnecessary?: boolean;
    severity?: Severity;
  }): void;
}

export interface Rule {
  id: string;
  summary: string;
  defaultSeverity: Severity;
  category: 'ladder' | 'item' | 'pace' | 'format' | 'records';
  /** A paragraph for the docs: what it checks, the numbers it uses, how to fix it. */
  docs: string;
  check(ctx: RuleContext, report: Report): void;
  /** The finding kinds this rule owns (core/findings.ts); each kind has exactly one owner. */
  kinds?: readonly FindingKind[];
  /** Words one finding of an owned kind (also used for findings in config and lexicon files). */
  describe?(f: Finding): Described;
  /**
   * A rung-local rule also checks one rung at a time: what it reports about a rung depends only on
   * that rung, the script's settings and head, and the lint settings. lint() keeps each rung's
   * reports while the rung's analysis is unchanged, so an edit re-checks only the rungs it touched.
   */
  checkRung?(ctx: RuleContext, rung: RungAnalysis, report: Report): void;
}

/** `check` for a rung-local rule: its `checkRung` over every rung in order. */
export function eachRung(checkRung: NonNullable<Rule['checkRung']>): Pick<Rule, 'check' | 'checkRung'> {
  return {
    checkRung,
    check(ctx, report) {
      for (const r of ctx.analysis.rungs) checkRung(ctx, r, report);
    },
  };
}

/** Per-rule severity overrides ("off" silences a rule), from config files or editor settings. */
export type SeverityOverrides = Record<string, Severity | 'off'>;

/** What the ladder rules read per item: the composite difficulty (default) or one metric. */
export type LadderMetric = 'difficulty' | 'words' | 'syllables' | 'phonemes' | 'wcm' | 'rarity';

export const LADDER_METRICS: LadderMetric[] = ['difficulty', 'words', 'syllables', 'phonemes', 'wcm', 'rarity'];

export interface LadderSettings {
  /** The number the ladder rules compare between rungs; default `difficulty`. */
  metric?: LadderMetric;
  /**
   * Largest step on that metric. For `difficulty` the script's `@max-step` is used; for another
   * metric step-too-big only runs when this is set (difficulty points do not carry over).
   */
  maxStep?: number;
}

export interface LintSettings {
  severities: SeverityOverrides;
  ladder?: LadderSettings;
}

export type { Problem };
