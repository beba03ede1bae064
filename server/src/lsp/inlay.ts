// Inlay hints at the end of item lines: projected duration at the rung's first pace and the
// composite difficulty, marked "≈" when it rests on estimated pronunciations. Off with
// `rungs.inlayHints.enabled: false`.
import { isEstimated } from '../core/pronounce';
import { InlayHintKind, MarkupKind, type InlayHint, type Range } from 'vscode-languageserver/node';
import type { Snapshot } from './documents';
import { diff, diffMarked, ESTIMATED_MARK, estimatedWords, md, secs } from './display';

export function inlayHints(s: Snapshot, range: Range): InlayHint[] {
  if (!s.settings.inlayHints.enabled) return [];
  const hints: InlayHint[] = [];
  // Items are in line order: find the first one in the range, then read only the range.
  const items = s.analysis.items;
  let lo = 0;
  let hi = items.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (items[mid].node.line < range.start.line) lo = mid + 1;
    else hi = mid;
  }
  for (let k = lo; k < items.length && items[k].node.line <= range.end.line; k++) {
    const item = items[k];
    const rung = s.analysis.rungs[item.rung];
    const pace = rung.paces[0];
    const line = item.node.line;
    const t = item.timings[0];
    const raw = s.lines[line] ?? '';
    const n = item.estimatedWords;
    const estimated = item.words.filter((w) => isEstimated(w)).map((w) => md(w.spoken));
    const note = n ? ` ${ESTIMATED_MARK} ${estimatedWords(n)} (${[...new Set(estimated)].join(', ')}), so the difficulty is approximate.` : '';
    hints.push({
      position: { line, character: raw.trimEnd().length },
      label: `${secs(t.seconds)} @ ${pace.label} · D ${diffMarked(item.difficulty, n)}`,
      kind: InlayHintKind.Type,
      paddingLeft: true,
      tooltip: {
        kind: MarkupKind.Markdown,
        value: `Projected ${secs(t.seconds)} at ${pace.label} (no pauses); difficulty ${diff(item.difficulty)}, rank ${item.rank} of ${rung.items.length} in "${md(rung.node.name)}".${note}`,
      },
    });
  }
  return hints;
}
