// Hover on an item's `@set` label: the balance table of that set against each other set it is
// compared with (over the whole script, or in the item's rung), from the same rows as the CLI.
import { MarkupKind, type Hover } from 'vscode-languageserver/node';
import { itemLabelSpans } from '../core/setLabels';
import { balanceRows, pairTitle } from '../core/setTable';
import { splitLabels } from '../core/parse';
import type { ItemAnalysis, Setting } from '../core/types';
import { setComparison } from '../rules/setRules';
import type { Snapshot } from './documents';
import { md } from './display';

/** `rung` limits a rung-by-rung comparison to one rung; null shows every rung. */
export function setHoverText(s: Snapshot, label: string, rung: number | null): string {
  const c = setComparison(s.analysis);
  const inScope = (r: number | null) => c.scope === 'script' || rung === null || r === rung;
  const pairs = c.pairs.filter((p) => (p.a === label || p.b === label) && inScope(p.rung));
  const out: string[] = [];
  const where = c.scope === 'script' ? 'over the whole script' : rung === null ? 'rung by rung' : 'in this rung';
  out.push(`**Set "${md(label)}"** · compared ${where}; equivalent means TOST within ±${c.bound} SD (\`@set-bound\`)`);
  for (const p of pairs) {
    const shown = balanceRows(p);
    out.push('', `**${md(pairTitle(p))}** (A = ${md(p.a)}, B = ${md(p.b)})`, '');
    out.push("| metric | A: n · mean ± SD | B: n · mean ± SD | Hedges' g [95 % CI] | Welch | Mann-Whitney | TOST p (lower / upper) | verdict |");
    out.push('|---|---|---|---|---|---|---|---|');
    for (const r of shown) out.push(`| ${[r.metric, r.a, r.b, r.g, r.welch, r.mwu, r.tost, r.verdict].map(md).join(' | ')} |`);
  }
  for (const small of c.small.filter((x) => x.label === label && inScope(x.rung))) {
    out.push('', `Only ${small.n} item${small.n === 1 ? '' : 's'} ${where}: too few to compare (\`@set-min-items\` ${c.minItems}).`);
  }
  if (!pairs.length && !c.small.some((x) => x.label === label && inScope(x.rung))) {
    out.push('', `No other set ${where} to compare with.`);
  }
  out.push('', 'Run `rungs sets FILE --balance` or the code action "Balance sets in this rung" to propose a better split.');
  return out.join('\n');
}

/** The hover of the `@set` label under the cursor, if there is one. */
export function setLabelHover(s: Snapshot, item: ItemAnalysis, character: number): Hover | null {
  const span = itemLabelSpans(s.lines[item.node.line] ?? '', item.node).find((x) => character >= x.start && character <= x.end);
  if (!span) return null;
  return {
    contents: { kind: MarkupKind.Markdown, value: setHoverText(s, span.label, item.rung) },
    range: { start: { line: item.node.line, character: span.start }, end: { line: item.node.line, character: span.end } },
  };
}

/** The hover of a label in a header or rung `@set` line (labels every item below inherits). */
export function setSettingHover(s: Snapshot, line: number, character: number): Hover | null {
  const header = s.analysis.script.header.map((setting) => ({ setting, rung: null as number | null }));
  const rungs = s.analysis.rungs.flatMap((r) => r.node.settings.map((setting) => ({ setting, rung: r.index as number | null })));
  const hit = [...header, ...rungs].find(
    ({ setting: x }) => (x.key === 'set' || x.key === 'sets') && x.line === line && character >= x.valueStart && character <= x.valueEnd,
  );
  if (!hit) return null;
  const span = labelAt(hit.setting, character);
  if (!span) return null;
  return {
    contents: { kind: MarkupKind.Markdown, value: setHoverText(s, span.label, hit.rung) },
    range: { start: { line, character: span.start }, end: { line, character: span.end } },
  };
}

function labelAt(x: Setting, character: number): { label: string; start: number; end: number } | null {
  let from = 0;
  for (const label of splitLabels(x.value)) {
    const at = x.value.indexOf(label, from);
    from = at + label.length;
    const start = x.valueStart + at;
    if (character >= start && character <= start + label.length) return { label, start, end: start + label.length };
  }
  return null;
}
