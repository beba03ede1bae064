// Small helpers the rules share: how rungs are named in messages, which number a ladder rule
// reads (the composite difficulty or one metric), robust statistics, and where paces were set.
import { median } from '../core/difficulty';
import { formatNumber } from '../core/pace';
import { lineEnding } from '../core/parse';
import type { Analysis, ItemAnalysis, Pace, Range, RelatedInfo, RungAnalysis, Setting } from '../core/types';
import type { LadderMetric, LintSettings, Report, RuleContext } from './types';
import { maxOf, minOf } from '../core/arrays';
import { excerpt } from '../core/excerpt';

/** One decimal, as the score table shows difficulty: 21.7, 24.0. */
export const fmt = (n: number): string => (Math.abs(n) < 0.05 ? 0 : n).toFixed(1);

/** A limit as the user wrote it: 12, 2.5. */
export const fmtLimit = (n: number): string => formatNumber(n, 2);

/** How a metric is named in messages. */
export const METRIC_NAMES: Record<LadderMetric, string> = {
  difficulty: 'difficulty',
  words: 'words',
  syllables: 'syllables',
  phonemes: 'phonemes',
  wcm: 'WCM',
  rarity: 'rarity (7 - mean Zipf)',
};

/** The number a ladder or outlier rule reads from an item. */
export function metricOf(item: ItemAnalysis, metric: LadderMetric): number {
  switch (metric) {
    case 'words':
      return item.wordCount;
    case 'syllables':
      return item.syllables;
    case 'phonemes':
      return item.phonemes;
    case 'wcm':
      return item.wcm;
    case 'rarity':
      return 7 - item.zipfMean;
    default:
      return item.difficulty;
  }
}

// The one median of the project (core/difficulty.ts), re-exported for the rules.
export { median };

/** A rung summarised on the chosen metric; rungs without items are left out of ladder checks. */
export interface RungStat {
  rung: RungAnalysis;
  values: number[];
  median: number;
  min: number;
  max: number;
}

export function ladderMetric(ctx: Pick<RuleContext, 'settings'>): LadderMetric {
  return ctx.settings.ladder?.metric ?? 'difficulty';
}

/**
 * Values computed once per analysis and shared by every rule that needs them (rung statistics,
 * the line ending), keyed by the analysis object so nothing outlives it. Keys must name
 * everything else the value depends on (the ladder metric).
 */
const memos = new WeakMap<object, Map<string, unknown>>();

export function memo<T>(ctx: Pick<RuleContext, 'analysis'>, key: string, make: () => T): T {
  let m = memos.get(ctx.analysis);
  if (!m) memos.set(ctx.analysis, (m = new Map()));
  if (!m.has(key)) m.set(key, make());
  return m.get(key) as T;
}

/** The script's line ending, for fixes that insert lines. */
export function eolOf(ctx: Pick<RuleContext, 'analysis' | 'text'>): string {
  return memo(ctx, 'eol', () => lineEnding(ctx.text));
}

/**
 * A value to one decimal, as messages show it. Counts and the composite difficulty (already rounded
 * to one decimal) are returned as they are: Number(x.toFixed(1)) gives them back unchanged, and
 * formatting every item of a large library to a string and back costs more than the rules.
 */
export function oneDecimal(x: number): number {
  if (x === 0) return 0; // -0 formats as "0.0"
  return Number.isInteger(x) || x === Math.round(x * 10) / 10 ? x : Number(x.toFixed(1));
}

const valuesByRung = new WeakMap<RungAnalysis, Map<LadderMetric, number[]>>();

/**
 * A rung's items on a ladder metric, rounded as messages show them. Kept per rung analysis, so
 * rungs an edit did not touch are not read again.
 */
export function rungValues(rung: RungAnalysis, metric: LadderMetric): number[] {
  let m = valuesByRung.get(rung);
  if (!m) valuesByRung.set(rung, (m = new Map()));
  let v = m.get(metric);
  if (!v) m.set(metric, (v = rung.items.map((i) => oneDecimal(metricOf(i, metric)))));
  return v;
}

/** The largest step the ladder is judged by, and where it was set; undefined: no limit. */
export interface StepLimit {
  value: number | undefined;
  /** `@max-step` (difficulty ladders without a configured step) or `ladder.maxStep`. */
  source: '@max-step' | 'ladder.maxStep';
}

/**
 * The step limit of a ladder: for `difficulty`, `ladder.maxStep` when configured, else the
 * script's `@max-step`; for another metric only `ladder.maxStep` (difficulty points do not carry
 * over). step-too-big, the ladder view, the rung hover and the code lens all read this.
 */
export function stepLimit(analysis: Analysis, settings: LintSettings): StepLimit {
  const metric = settings.ladder?.metric ?? 'difficulty';
  const configured = settings.ladder?.maxStep;
  if (metric === 'difficulty' && configured === undefined) return { value: analysis.options.maxStep, source: '@max-step' };
  return { value: configured, source: 'ladder.maxStep' };
}

/** One rung's summary on the ladder metric in force (undefined for a rung without items). */
export function rungStatsByIndex(analysis: Analysis, settings: LintSettings): Map<number, RungStat> {
  return new Map(rungStats({ analysis, settings }).map((st) => [st.rung.index, st]));
}

const statsByRung = new WeakMap<RungAnalysis, Map<LadderMetric, RungStat>>();

/**
 * One rung's summary on a metric, kept with the rung's analysis like its values: an edit sorts
 * the values of the rungs it touched for their medians, not those of every rung.
 */
export function rungStat(rung: RungAnalysis, metric: LadderMetric): RungStat {
  let m = statsByRung.get(rung);
  if (!m) statsByRung.set(rung, (m = new Map()));
  let st = m.get(metric);
  if (!st) {
    const values = rungValues(rung, metric);
    m.set(metric, (st = { rung, values, median: median(values), min: minOf(values), max: maxOf(values) }));
  }
  return st;
}

export function rungStats(ctx: Pick<RuleContext, 'analysis' | 'settings'>): RungStat[] {
  const metric = ladderMetric(ctx);
  return memo(ctx, `stats:${metric}`, () => ctx.analysis.rungs.filter((r) => r.items.length > 0).map((rung) => rungStat(rung, metric)));
}

/** `rung 3 "Back to short"`: 1-based, with the name, as every message writes it. */
export function rungLabel(r: RungAnalysis): string {
  let label = labels.get(r);
  if (label === undefined) labels.set(r, (label = `rung ${r.index + 1} "${excerpt(r.node.name)}"`));
  return label;
}

/** Labels kept with each rung's analysis (an index and a name that never change on it). */
const labels = new WeakMap<RungAnalysis, string>();

/** The rung header line (or the first item of an implicit rung), for reports and related info. */
export function rungRange(ctx: RuleContext, r: RungAnalysis): Range {
  const line = r.node.line;
  const text = ctx.lines[line] ?? '';
  const start = text.length - text.trimStart().length;
  return { line, character: start, endLine: line, endCharacter: Math.max(start + 1, text.trimEnd().length) };
}

export function rungRelated(ctx: RuleContext, r: RungAnalysis, message: string): RelatedInfo {
  return { ...rungRange(ctx, r), message };
}

export function itemRange(item: ItemAnalysis): Range {
  return { line: item.node.line, character: item.node.textStart, endLine: item.node.line, endCharacter: item.node.textEnd };
}

/** Whether a rung is harder than the one before it, in the script's direction. */
export function sign(ctx: RuleContext): 1 | -1 {
  return ctx.analysis.options.direction === 'falling' ? -1 : 1;
}

/** The setting line a rung's paces came from (its own @pace, else the header's), if written. */
export function paceSetting(ctx: RuleContext, r: RungAnalysis): Setting | null {
  const own = r.node.settings.filter((s) => s.key === 'pace' || s.key === 'paces');
  if (own.length) return own[own.length - 1];
  const head = ctx.analysis.script.header.filter((s) => s.key === 'pace' || s.key === 'paces');
  return head.length ? head[head.length - 1] : null;
}

export function settingRange(s: Setting): Range {
  return { line: s.line, character: s.keyStart, endLine: s.line, endCharacter: Math.max(s.valueEnd, s.keyEnd) };
}

/** Where to report something about a rung's pace: the line that set it, else the rung header. */
export function paceRange(ctx: RuleContext, r: RungAnalysis): Range {
  const s = paceSetting(ctx, r);
  return s ? settingRange(s) : rungRange(ctx, r);
}

const totals = new WeakMap<RungAnalysis, { words: number; syllables: number }>();

/** Words and syllables of a rung, summed once per rung (several rules ask for each pace). */
export function rungTotals(r: RungAnalysis): { words: number; syllables: number } {
  let t = totals.get(r);
  if (!t) {
    t = { words: 0, syllables: 0 };
    for (const i of r.items) {
      t.words += i.wordCount;
      t.syllables += i.syllables;
    }
    totals.set(r, t);
  }
  return t;
}

/**
 * Visits each pace of each rung with items, and reports what `judge` says about it (a message, or
 * null when the pace is fine) on the line that set the pace. A pace set once in the header and
 * inherited by several rungs is reported once, on the first rung it is judged on.
 */
export function reportPaces(ctx: RuleContext, judge: (r: RungAnalysis, pace: Pace) => string | null, report: Report): void {
  const done = new Set<string>();
  for (const r of ctx.analysis.rungs) {
    if (!r.items.length) continue;
    const range = paceRange(ctx, r);
    for (const pace of r.paces) {
      const key = `${range.line}:${pace.label}`;
      if (done.has(key)) continue;
      const message = judge(r, pace);
      if (message === null) continue;
      done.add(key);
      report({ ...range, message });
    }
  }
}

/** Words per second a pace implies on a rung (sps paces depend on the rung's syllables per word). */
export function rungWordRate(r: RungAnalysis, pace: Pace): number {
  const { words, syllables } = rungTotals(r);
  if (pace.unit === 'wps') return pace.value;
  return syllables > 0 ? (pace.value * words) / syllables : 0;
}

/** Syllables per second a pace implies on a rung. */
export function rungSyllableRate(r: RungAnalysis, pace: Pace): number {
  const { words, syllables } = rungTotals(r);
  if (pace.unit === 'sps') return pace.value;
  return words > 0 ? (pace.value * syllables) / words : 0;
}
