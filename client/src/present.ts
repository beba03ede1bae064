// Small pure helpers of the extension that need no editor, so they are unit-tested directly.
import type { ItemAt, Ladder } from './protocol';

/** The status bar text and tooltip for the item under the cursor. */
export function describeItem(item: ItemAt): { text: string; tooltip: string } {
  const d = String(Number(item.difficulty.toFixed(1)));
  const s = item.seconds < 10 ? String(Number(item.seconds.toFixed(1))) : String(Math.round(item.seconds));
  return {
    text: `$(graph-line) ${d} · ${s} s @ ${item.pace}`,
    tooltip: `Difficulty ${d} (rank ${item.rank} in "${item.rungName}"), ${s} seconds at ${item.pace}. Click to show the ladder.`,
  };
}

/** The header line of the rung that holds `line`: the last rung starting at or above it. */
export function rungLineAt(ladder: Ladder | null, line: number): number | null {
  let best: number | null = null;
  for (const r of ladder?.rungs ?? []) {
    const start = Math.min(r.line, ...r.items.map((i) => i.line));
    if (start <= line && (best === null || r.line > best)) best = r.line;
  }
  return best;
}
