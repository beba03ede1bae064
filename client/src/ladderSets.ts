// Set marks of the ladder view: each item's `@set` label drawn as a short letter beside its point,
// coloured per set, with a legend. Shapes and colours alone would not carry the label for
// everyone, so the letter and the point's tooltip name the set too.
import type { Ladder, LadderItem } from './protocol';

/** Labels in order of first appearance, each with a short mark (its initial, or a number on clashes). */
export function setMarks(ladder: Ladder): Map<string, { mark: string; index: number }> {
  const labels: string[] = [];
  for (const r of ladder.rungs) for (const it of r.items) for (const l of it.sets ?? []) if (!labels.includes(l)) labels.push(l);
  const initials = labels.map((l) => l.charAt(0).toUpperCase());
  const clash = new Set(initials).size < initials.length;
  return new Map(labels.map((l, i) => [l, { mark: clash ? String(i + 1) : initials[i], index: i }]));
}

/** The SVG text of an item's set mark, placed to the right of its point; empty without a set. */
export function setMarkSvg(marks: Map<string, { mark: string; index: number }>, it: LadderItem, cx: number, cy: number, escape: (s: string) => string): string {
  const sets = it.sets ?? [];
  if (!sets.length) return '';
  const first = marks.get(sets[0])!;
  const text = sets.map((s) => marks.get(s)!.mark).join('');
  return `<text class="set-mark set-${first.index % 4}" data-set="${escape(sets.join(' '))}" x="${(cx + 6).toFixed(1)}" y="${(cy + 3.5).toFixed(1)}">${escape(text)}</text>`;
}

/** "Sets: T trained, U untrained." for the legend; empty when no item has a set. */
export function setLegend(marks: Map<string, { mark: string; index: number }>, escape: (s: string) => string): string {
  if (!marks.size) return '';
  return ` Sets: ${[...marks].map(([l, m]) => `<span class="set-mark set-${m.index % 4}">${escape(m.mark)}</span> ${escape(l)}`).join(', ')}.`;
}

export const SET_MARK_CSS = [
  'svg.ladder text.set-mark { font-size: 9px; font-weight: bold; pointer-events: none; }',
  '.set-mark.set-0 { fill: var(--vscode-charts-orange); color: var(--vscode-charts-orange); }',
  '.set-mark.set-1 { fill: var(--vscode-charts-green); color: var(--vscode-charts-green); }',
  '.set-mark.set-2 { fill: var(--vscode-charts-purple); color: var(--vscode-charts-purple); }',
  '.set-mark.set-3 { fill: var(--vscode-charts-red); color: var(--vscode-charts-red); }',
].join('\n');
