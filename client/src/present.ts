// Small pure helpers of the extension that need no editor, so they are unit-tested directly.
// The contract module has no runtime dependencies; './protocol' pulls in the editor's client library.
import { ESTIMATED_MARK } from '../../server/src/lsp/contract';
import type { ItemAt, Ladder } from './protocol';

/** "≈" when a number rests on estimated pronunciations, else nothing. */
export const estimatedMark = (estimatedWords: number | undefined): string => (estimatedWords ? ESTIMATED_MARK : '');

/** "≈ 2 words with an estimated pronunciation", or '' when there are none. */
export function estimatedNote(estimatedWords: number | undefined): string {
  const n = estimatedWords ?? 0;
  return n ? `${ESTIMATED_MARK} ${n} word${n === 1 ? '' : 's'} with an estimated pronunciation` : '';
}

/** The status bar text and tooltip for the item under the cursor. */
export function describeItem(item: ItemAt): { text: string; tooltip: string } {
  const d = estimatedMark(item.estimatedWords) + String(Number(item.difficulty.toFixed(1)));
  const s = item.seconds < 10 ? String(Number(item.seconds.toFixed(1))) : String(Math.round(item.seconds));
  const note = estimatedNote(item.estimatedWords);
  return {
    text: `$(graph-line) ${d} · ${s} s @ ${item.pace}`,
    tooltip: `Difficulty ${d} (rank ${item.rank} in "${item.rungName}"), ${s} seconds at ${item.pace}.${note ? ` ${note}, so the difficulty is approximate.` : ''} Click to show the ladder.`,
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
