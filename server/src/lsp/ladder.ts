// The custom requests the VS Code client's ladder view and status bar use. Names and shapes are
// a contract with client/ (keep them): `rungs/ladder`, `rungs/itemAt`, and the notification
// `rungs/didAnalyze` sent after every analysis.
import { NotificationType, RequestType } from 'vscode-languageserver/node';
import { DID_ANALYZE_METHOD, ITEM_AT_METHOD, LADDER_METHOD, type ItemAt, type Ladder } from './contract';
import { maxOf } from '../core/arrays';
import { ladderSteps } from '../report/ladderSteps';
import { ladderMetric, METRIC_NAMES, metricOf, rungStatsByIndex, stepLimit } from '../rules/shared';
import type { Snapshot } from './documents';

export type { Ladder, LadderItem, LadderRung, LadderStep, ItemAt as ItemAtResult } from './contract';

export const LadderRequest = new RequestType<{ uri: string }, Ladder | null, void>(LADDER_METHOD);
export const ItemAtRequest = new RequestType<{ uri: string; line: number }, ItemAt | null, void>(ITEM_AT_METHOD);
export const DidAnalyzeNotification = new NotificationType<{ uri: string; version: number }>(DID_ANALYZE_METHOD);

const round1 = (n: number) => Math.round(n * 10) / 10;

export function ladder(s: Snapshot): Ladder {
  const a = s.analysis;
  const title = a.script.header.find((h) => h.key === 'title')?.value.trim() || null;
  // The medians and the step limit are those the ladder rules judge (the configured metric).
  const metric = ladderMetric({ settings: s.lint });
  const stats = rungStatsByIndex(a, s.lint);
  const on = (r: (typeof a.rungs)[number]) => (metric === 'difficulty' ? r : stats.get(r.index) ?? { median: 0, min: 0, max: 0 });
  const rungs = a.rungs.map((r) => ({
    name: r.node.name,
    line: r.node.line,
    median: on(r).median,
    min: on(r).min,
    max: on(r).max,
    paces: r.paces.map((p) => p.label),
    items: r.items.map((it) => ({
      line: it.node.line,
      text: it.node.text,
      difficulty: it.difficulty,
      value: round1(metricOf(it, metric)),
      rank: it.rank,
      estimatedWords: it.estimatedWords,
      sets: it.sets,
    })),
  }));
  // Steps are measured on the same metric as the rungs' medians above.
  const steps = ladderSteps(a, s.problems, (r) => on(r).median);
  const values = rungs.flatMap((r) => r.items.map((i) => i.value));
  return {
    title,
    direction: a.options.direction,
    metric: METRIC_NAMES[metric],
    scaleMax: metric === 'difficulty' ? 100 : Math.max(1, Math.ceil(maxOf([0, ...values]))),
    maxStep: stepLimit(a, s.lint).value ?? null,
    rungs,
    steps,
    problems: s.problems.map((p) => ({ rule: p.rule, severity: p.severity, line: p.line, message: p.message })),
  };
}

export function itemAt(s: Snapshot, line: number): ItemAt | null {
  const item = s.itemAt(line);
  if (!item) return null;
  const rung = s.analysis.rungs[item.rung];
  const t = item.timings[0];
  return {
    line,
    difficulty: item.difficulty,
    rank: item.rank,
    rungName: rung.node.name,
    pace: t?.pace.label ?? '',
    seconds: t?.seconds ?? 0,
    estimatedWords: item.estimatedWords,
  };
}
