// Outline and folding: rungs with their items as children; one folding range per rung.
import { FoldingRangeKind, SymbolKind, type DocumentSymbol, type FoldingRange } from 'vscode-languageserver/node';
import type { Snapshot } from './documents';
import { diff } from './display';

function lastLine(s: Snapshot, index: number): number {
  const rungs = s.analysis.rungs;
  const next = rungs[index + 1];
  const end = Math.max(rungs[index].node.endLine, rungs[index].node.line);
  return next ? Math.min(end, next.node.line - 1) : end;
}

export function documentSymbols(s: Snapshot): DocumentSymbol[] {
  return s.analysis.rungs.map((rung) => {
    const end = lastLine(s, rung.index);
    const headerText = s.lines[rung.node.line] ?? '';
    const n = rung.items.length;
    return {
      name: rung.node.name,
      detail: n ? `${n} item${n === 1 ? '' : 's'} · median ${diff(rung.median)}` : 'no items',
      kind: SymbolKind.Namespace,
      range: { start: { line: rung.node.line, character: 0 }, end: { line: end, character: s.lines[end]?.length ?? 0 } },
      selectionRange: { start: { line: rung.node.line, character: 0 }, end: { line: rung.node.line, character: headerText.length } },
      children: rung.items.map((item) => {
        const range = {
          start: { line: item.node.line, character: item.node.textStart },
          end: { line: item.node.line, character: item.node.textEnd },
        };
        return {
          name: item.node.text,
          detail: `difficulty ${diff(item.difficulty)} · rank ${item.rank}${item.node.id ? ` · #${item.node.id}` : ''}`,
          kind: SymbolKind.String,
          range,
          selectionRange: range,
        };
      }),
    };
  });
}

export function foldingRanges(s: Snapshot): FoldingRange[] {
  const out: FoldingRange[] = [];
  s.analysis.rungs.forEach((rung, i) => {
    const end = lastLine(s, i);
    if (end > rung.node.line) out.push({ startLine: rung.node.line, endLine: end, kind: FoldingRangeKind.Region });
  });
  // A run of three or more comment lines folds as a comment block.
  const comments = s.analysis.script.comments;
  let start = -1;
  comments.forEach((c, i) => {
    if (start < 0) start = c.line;
    const next = comments[i + 1];
    if (!next || next.line !== c.line + 1) {
      if (c.line - start >= 2) out.push({ startLine: start, endLine: c.line, kind: FoldingRangeKind.Comment });
      start = -1;
    }
  });
  return out;
}
