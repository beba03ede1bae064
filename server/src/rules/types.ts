// The shape every ladder/quality rule shares. One rule per file, metadata first; the id is the
// join key everywhere (LSP diagnostic code and docs link, SARIF ruleId, JSON output, settings).
import type { Analysis, Fix, Problem, RelatedInfo, Severity } from '../core/types';

export interface RuleContext {
  analysis: Analysis;
  /** The script's lines, for rules that build fixes from the original text. */
  lines: string[];
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
  category: 'ladder' | 'item' | 'pace' | 'format';
  /** A paragraph for the docs: what it checks, the numbers it uses, how to fix it. */
  docs: string;
  check(ctx: RuleContext, report: Report): void;
}

/** Per-rule severity overrides ("off" silences a rule), from config files or editor settings. */
export type SeverityOverrides = Record<string, Severity | 'off'>;

export interface LintSettings {
  severities: SeverityOverrides;
}

export type { Problem };
