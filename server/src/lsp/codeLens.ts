// Code lenses on rung headers: the rung summary (difficulties marked "≈" when they rest on
// estimated pronunciations), and "Sort by difficulty" when the rung is not in order (it runs the
// server command `rungs.sortRung`).
import type { CodeLens } from 'vscode-languageserver/node';
import type { Snapshot } from './documents';
import { diffMarked, ESTIMATED_MARK, secs } from './display';
import { rungNeedsSort } from './sortRung';
import { ladderMetric, METRIC_NAMES, rungStatsByIndex } from '../rules/shared';
import { SORT_RUNG_COMMAND } from './contract';
import { describeLengths, rungLength } from '../core/timing';

export { SORT_RUNG_COMMAND };

/** The lenses of a snapshot: an editor asks again on every scroll and focus, for the same version. */
const bySnapshot = new WeakMap<Snapshot, CodeLens[]>();

export function codeLenses(s: Snapshot): CodeLens[] {
  let lenses = bySnapshot.get(s);
  if (!lenses) bySnapshot.set(s, (lenses = makeLenses(s)));
  return lenses;
}

function makeLenses(s: Snapshot): CodeLens[] {
  const lenses: CodeLens[] = [];
  // The summary shows the metric the ladder rules judge (config `ladder.metric`).
  const metric = ladderMetric({ settings: s.lint });
  const stats = rungStatsByIndex(s.analysis, s.lint);
  for (const rung of s.analysis.rungs) {
    const line = rung.node.line;
    const range = { start: { line, character: 0 }, end: { line, character: 0 } };
    const n = rung.items.length;
    const times = rung.paces.map((p, i) => `${secs(rung.totalSeconds[i])} at ${p.label}`).join(', ');
    const est = rung.items.reduce((sum, it) => sum + it.estimatedWords, 0);
    const d = (x: number) => diffMarked(x, est);
    const on = metric === 'difficulty' ? rung : stats.get(rung.index) ?? rung;
    const estimated = est ? ` · ${ESTIMATED_MARK} ${est} estimated pronunciation${est === 1 ? '' : 's'}` : '';
    const title = n
      ? `${n} item${n === 1 ? '' : 's'} · ${METRIC_NAMES[metric]} ${d(on.min)}–${d(on.max)}, median ${d(on.median)} · ${times}${estimated}`
      : 'no items';
    lenses.push({ range, command: { title, command: '' } });
    // The session length comes from the timing plan, so it matches cue tracks and model audio.
    if (n) {
      const gap = s.analysis.options.timing.gap;
      lenses.push({ range, command: { title: `session ${describeLengths(rungLength(s.analysis, rung.index).paces)} (with ${gap} s gaps)`, command: '' } });
    }
    if (rungNeedsSort(s, rung)) {
      lenses.push({ range, command: { title: 'Sort by difficulty', command: SORT_RUNG_COMMAND, arguments: [s.uri, line] } });
    }
  }
  return lenses;
}
