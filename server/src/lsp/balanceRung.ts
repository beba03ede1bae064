// The code action "Balance sets in this rung": the balancer run on one rung (seed 1, so the same
// text always gets the same proposal), offered only when it finds a better split. Proposals are
// kept per analysed text, so moving the cursor about a rung does not rerun the search.
import { CodeActionKind, type CodeAction } from 'vscode-languageserver/node';
import { balanceSets } from '../core/balance';
import type { Analysis, RungAnalysis, TextEdit } from '../core/types';
import { toLspTextEdit } from './convert';
import type { Snapshot } from './documents';

export const BALANCE_RUNG_TITLE = 'Balance sets in this rung';

const proposals = new WeakMap<Analysis, Map<number, TextEdit[]>>();

export function balanceRungEdits(s: Snapshot, rung: RungAnalysis): TextEdit[] {
  let byRung = proposals.get(s.analysis);
  if (!byRung) {
    byRung = new Map();
    proposals.set(s.analysis, byRung);
  }
  let edits = byRung.get(rung.index);
  if (!edits) {
    // Rungs without two labels among their own items have nothing to swap: skip the search.
    const labels = new Set(rung.items.filter((i) => i.node.sets.length === 1).map((i) => i.node.sets[0]));
    edits = labels.size < 2 ? [] : balanceSets(s.analysis, s.text, { seed: 1, rungs: [rung.index] }).edits;
    byRung.set(rung.index, edits);
  }
  return edits;
}

export function balanceRungActions(s: Snapshot, rung: RungAnalysis): CodeAction[] {
  const edits = balanceRungEdits(s, rung);
  if (!edits.length) return [];
  return [{ title: BALANCE_RUNG_TITLE, kind: CodeActionKind.RefactorRewrite, edit: { changes: { [s.uri]: edits.map(toLspTextEdit) } } }];
}
