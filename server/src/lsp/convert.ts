// The one place that turns core positions and problems into LSP shapes. Core ranges are 0-based
// lines and UTF-16 offsets, which is exactly LSP's default position encoding, so no re-counting.
import {
  DiagnosticSeverity,
  DiagnosticTag,
  type Diagnostic,
  type Range as LspRange,
  type TextEdit as LspTextEdit,
} from 'vscode-languageserver/node';
import type { Problem, Range, Severity, TextEdit } from '../core/types';
import { ruleDocsUrl } from '../rules/docs';

export function toLspRange(r: Range): LspRange {
  return { start: { line: r.line, character: r.character }, end: { line: r.endLine, character: r.endCharacter } };
}

export function toLspTextEdit(e: TextEdit): LspTextEdit {
  return { range: toLspRange(e), newText: e.newText };
}

const SEVERITY: Record<Severity, DiagnosticSeverity> = {
  error: DiagnosticSeverity.Error,
  warning: DiagnosticSeverity.Warning,
  info: DiagnosticSeverity.Information,
  hint: DiagnosticSeverity.Hint,
};

export function toLspSeverity(s: Severity): DiagnosticSeverity {
  return SEVERITY[s] ?? DiagnosticSeverity.Warning;
}

export const DIAGNOSTIC_SOURCE = 'rungs';

export function toLspDiagnostic(p: Problem, uri: string): Diagnostic {
  const d: Diagnostic = {
    range: toLspRange(p),
    severity: toLspSeverity(p.severity),
    code: p.rule,
    codeDescription: { href: ruleDocsUrl(p.rule) },
    source: DIAGNOSTIC_SOURCE,
    message: p.message,
  };
  if (p.unnecessary) d.tags = [DiagnosticTag.Unnecessary];
  if (p.related?.length) {
    d.relatedInformation = p.related.map((r) => ({ location: { uri, range: toLspRange(r) }, message: r.message }));
  }
  return d;
}

/** True when two core ranges touch or overlap (an empty range at a boundary counts). */
export function rangesTouch(a: Range, b: Range): boolean {
  const before = (l1: number, c1: number, l2: number, c2: number) => l1 < l2 || (l1 === l2 && c1 < c2);
  return !before(a.endLine, a.endCharacter, b.line, b.character) && !before(b.endLine, b.endCharacter, a.line, a.character);
}

export function fromLspRange(r: LspRange): Range {
  return { line: r.start.line, character: r.start.character, endLine: r.end.line, endCharacter: r.end.character };
}
