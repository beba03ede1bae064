// Code lenses on rung headers: the rung summary, and "Sort by difficulty" when the rung is not
// in order (it runs the server command `rungs.sortRung`).
import type { CodeLens } from 'vscode-languageserver/node';
import type { Snapshot } from './documents';
import { diff, secs } from './format';
import { sortRung } from './sortRung';
import { SORT_RUNG_COMMAND } from './contract';

export { SORT_RUNG_COMMAND };

export function codeLenses(s: Snapshot): CodeLens[] {
  const lenses: CodeLens[] = [];
  for (const rung of s.analysis.rungs) {
    const line = rung.node.line;
    const range = { start: { line, character: 0 }, end: { line, character: 0 } };
    const n = rung.items.length;
    const times = rung.paces.map((p, i) => `${secs(rung.totalSeconds[i])} at ${p.label}`).join(', ');
    const title = n
      ? `${n} item${n === 1 ? '' : 's'} · difficulty ${diff(rung.min)}–${diff(rung.max)}, median ${diff(rung.median)} · ${times}`
      : 'no items';
    lenses.push({ range, command: { title, command: '' } });
    if (sortRung(s, rung)) {
      lenses.push({ range, command: { title: 'Sort by difficulty', command: SORT_RUNG_COMMAND, arguments: [s.uri, line] } });
    }
  }
  return lenses;
}
