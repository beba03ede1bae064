// Code lenses on rung headers: the rung summary (difficulties marked "≈" when they rest on
// estimated pronunciations), and "Sort by difficulty" when the rung is not in order (it runs the
// server command `rungs.sortRung`).
import type { CodeLens } from 'vscode-languageserver/node';
import type { Snapshot } from './documents';
import { diffMarked, ESTIMATED_MARK, secs } from './display';
import { rungNeedsSort } from './sortRung';
import { ladderMetric, METRIC_NAMES, rungStat } from '../rules/shared';
import type { LadderMetric } from '../rules/types';
import type { RungAnalysis } from '../core/types';
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

/**
 * Each rung's lenses, kept with its analysis: what they show is the rung's own (its items, line,
 * paces and lengths) plus the few settings in the key, so a new version works out again only the
 * rungs an edit touched. Before, every version summed the estimated words of all 10,000 items and
 * built every rung's ladder statistics again.
 */
const byRung = new WeakMap<RungAnalysis, { key: string; lenses: CodeLens[] }>();

function makeLenses(s: Snapshot): CodeLens[] {
  const lenses: CodeLens[] = [];
  // The summary shows the metric the ladder rules judge (config `ladder.metric`).
  const metric = ladderMetric({ settings: s.lint });
  const { timing, direction } = s.analysis.options;
  const key = `${metric}|${direction}|${JSON.stringify(timing)}|${s.uri}`;
  for (const rung of s.analysis.rungs) {
    const rungKey = `${key}|${rung.node.line}`;
    let hit = byRung.get(rung);
    if (hit?.key !== rungKey) byRung.set(rung, (hit = { key: rungKey, lenses: rungLenses(s, rung, metric) }));
    for (const lens of hit.lenses) lenses.push(lens);
  }
  return lenses;
}

function rungLenses(s: Snapshot, rung: RungAnalysis, metric: LadderMetric): CodeLens[] {
  const lenses: CodeLens[] = [];
  const line = rung.node.line;
  const range = { start: { line, character: 0 }, end: { line, character: 0 } };
  const n = rung.items.length;
  const times = rung.paces.map((p, i) => `${secs(rung.totalSeconds[i])} at ${p.label}`).join(', ');
  let est = 0;
  for (const it of rung.items) est += it.estimatedWords;
  const d = (x: number) => diffMarked(x, est);
  const on = metric === 'difficulty' || n === 0 ? rung : rungStat(rung, metric);
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
  return lenses;
}
