// Code actions: every mechanical fix the core and the rules attach to problems (as quick fixes,
// plus one "fix all" source action), "add pronunciation override" and "use listed pronunciation
// N" on a word, and "sort rung by difficulty" anywhere in a rung.
import { isEstimated } from '../core/pronounce';
import {
  CodeActionKind,
  type CodeAction,
  type CodeActionParams,
  type Diagnostic,
  type WorkspaceEdit,
} from 'vscode-languageserver/node';
import { tokenize, type Token } from '../core/tokenize';
import type { ItemAnalysis, Problem, TextEdit, WordAnalysis } from '../core/types';
import { batchEdits } from '../rules/fixes';
import { fromLspRange, rangesTouch, toLspDiagnostic, toLspTextEdit } from './convert';
import type { Snapshot } from './documents';
import { sortRung } from './sortRung';
import { lineEnding } from '../core/parse';
import { balanceRungActions } from './balanceRung';

export const FIX_ALL_KIND = `${CodeActionKind.SourceFixAll}.rungs`;

function edit(s: Snapshot, edits: TextEdit[]): WorkspaceEdit {
  return { changes: { [s.uri]: edits.map(toLspTextEdit) } };
}

function sameDiagnostic(d: Diagnostic, p: Problem): boolean {
  return (
    d.code === p.rule &&
    d.range.start.line === p.line &&
    d.range.start.character === p.character &&
    d.range.end.line === p.endLine &&
    d.range.end.character === p.endCharacter
  );
}

/** Where a new `@say` line goes: after the last header setting or override, else after leading comments. */
function overrideInsertLine(s: Snapshot): number {
  const firstRung = s.analysis.rungs.find((r) => !r.node.implicit)?.node.line ?? Infinity;
  const firstItem = s.analysis.items[0]?.node.line ?? Infinity;
  const limit = Math.min(firstRung, firstItem);
  let after = -1;
  for (const st of s.analysis.script.header) if (st.line < limit) after = Math.max(after, st.line);
  for (const o of s.analysis.script.overrides) if (o.line < limit) after = Math.max(after, o.line);
  if (after >= 0) return after + 1;
  let line = 0;
  while (line < s.lines.length && line < limit && s.lines[line].trimStart().startsWith('//')) line++;
  return line;
}

/** The written token a word comes from (words of one token share its offsets). */
function tokenOf(item: ItemAnalysis, w: WordAnalysis): Token | undefined {
  return tokenize(item.node.text, item.node.textStart).find((t) => t.start === w.start && t.end === w.end);
}

function wordActions(s: Snapshot, item: ItemAnalysis, w: WordAnalysis, line: number): CodeAction[] {
  const actions: CodeAction[] = [];
  const scriptOverride = s.analysis.script.overrides.find((o) => o.word === w.spoken);
  if (!scriptOverride && w.phones.length) {
    const at = overrideInsertLine(s);
    const eol = lineEnding(s.text);
    const estimated = isEstimated(w);
    actions.push({
      title: `Add pronunciation override for "${w.spoken}" (@say ${w.spoken} = ${w.phones.join(' ')})`,
      kind: estimated ? CodeActionKind.QuickFix : CodeActionKind.RefactorRewrite,
      edit: edit(s, [{ line: at, character: 0, endLine: at, endCharacter: 0, newText: `@say ${w.spoken} = ${w.phones.join(' ')}${eol}` }]),
    });
  }
  // The estimator's other candidates, each a quick fix writing it as the word's override.
  if (!scriptOverride && w.source === 'estimate') {
    const { alternatives } = s.analysis.pronouncer.pronouncer.score(w.spoken);
    const at = overrideInsertLine(s);
    alternatives.slice(1).forEach((c, i) => {
      const phones = c.phones.join(' ');
      actions.push({
        title: `Use estimate ${i + 2} for "${w.spoken}" (${Math.round(100 * c.share)} %): @say ${w.spoken} = ${phones}`,
        kind: CodeActionKind.QuickFix,
        edit: edit(s, [{ line: at, character: 0, endLine: at, endCharacter: 0, newText: `@say ${w.spoken} = ${phones}${lineEnding(s.text)}` }]),
      });
    });
  }
  // A variant mark "(n)" is read only after a plain word, and applies to every word of its token:
  // after "Dr." or "$5" it would be read aloud, after "well-read" it would apply to both parts.
  const token = w.variants.length > 1 ? tokenOf(item, w) : undefined;
  if (token && token.kind === 'word' && token.words.length === 1) {
    const markStart = token.variant === null ? w.end : w.end - '(n)'.length;
    w.variants.forEach((v, i) => {
      const n = i + 1;
      if (w.source === 'dictionary' && n === w.variant) return;
      const e: TextEdit = { line, character: markStart, endLine: line, endCharacter: w.end, newText: `(${n})` };
      actions.push({
        title: `Use listed pronunciation ${n} of "${w.spoken}": ${v.join(' ')}`,
        kind: CodeActionKind.RefactorRewrite,
        edit: edit(s, [e]),
      });
    });
  }
  return actions;
}

export function codeActions(s: Snapshot, params: CodeActionParams): CodeAction[] {
  const range = fromLspRange(params.range);
  const only = Array.isArray(params.context?.only) ? params.context.only : undefined;
  const wants = (kind: string) => !only || only.some((k) => kind === k || kind.startsWith(`${k}.`));
  const actions: CodeAction[] = [];

  if (wants(CodeActionKind.QuickFix)) {
    for (const p of s.problems) {
      if (!p.fix || !rangesTouch(p, range)) continue;
      const sent = Array.isArray(params.context?.diagnostics) ? params.context.diagnostics : [];
      const diagnostic = sent.find((d) => sameDiagnostic(d, p)) ?? toLspDiagnostic(p, s.uri);
      actions.push({
        title: p.fix.title,
        kind: CodeActionKind.QuickFix,
        diagnostics: [diagnostic],
        isPreferred: true,
        edit: edit(s, p.fix.edits),
      });
    }
  }

  const line = range.line;
  const item = s.itemAt(line);
  if (item && (wants(CodeActionKind.QuickFix) || wants(CodeActionKind.RefactorRewrite))) {
    const w = item.words.find((x) => range.character >= x.start && range.character <= x.end);
    if (w) actions.push(...wordActions(s, item, w, line).filter((a) => wants(a.kind!)));
  }

  const rung = s.rungContaining(line);
  if (rung && wants(CodeActionKind.RefactorRewrite)) {
    const e = sortRung(s, rung);
    const dup = e && actions.some((a) => JSON.stringify(a.edit) === JSON.stringify(edit(s, [e])));
    if (e && !dup) actions.push({ title: `Sort rung "${rung.node.name}" by difficulty`, kind: CodeActionKind.RefactorRewrite, edit: edit(s, [e]) });
    actions.push(...balanceRungActions(s, rung));
  }

  if (only?.some((k) => FIX_ALL_KIND.startsWith(k) && k.startsWith(CodeActionKind.Source))) {
    const edits = batchEdits(s.text, s.problems);
    if (edits.length) actions.push({ title: 'Fix all auto-fixable Rungs problems', kind: FIX_ALL_KIND, edit: edit(s, edits) });
  }
  return actions;
}
