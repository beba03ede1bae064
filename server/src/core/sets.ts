// Matched item sets: compares every pair of `@set` labels on every metric of the metric table,
// over the whole script or rung by rung. Pure: an analysed script in, plain data out. Later
// metrics join by adding a row to SET_METRICS.
//
// The verdict is the equivalence test (TOST on Welch's t against ±bound SD), never the mere
// absence of a significant difference (Sassenhagen & Alday 2016, Brain and Language 162;
// Lakens 2017, Social Psychological and Personality Science 8(4)); Hedges' g stands beside it.
import { averageSd, hedgesG, mannWhitney, summarize, tostWelch, welch, type MwuMethod, type Summary, type TostResult } from './stats';
import { DEFAULT_SET_OPTIONS, type SetOptions } from './setOptions';
import type { Analysis, ItemAnalysis, RungAnalysis, SetScope } from './types';

/** One row of the metric table: how a per-item number is read and shown. */
export interface SetMetric {
  /** Key in JSON and CSV output. */
  id: string;
  /** Column label for people. */
  name: string;
  /** Decimals when shown. */
  digits: number;
  value(item: ItemAnalysis): number;
}

export const SET_METRICS: SetMetric[] = [
  { id: 'words', name: 'words', digits: 2, value: (i) => i.wordCount },
  { id: 'syllables', name: 'syllables', digits: 2, value: (i) => i.syllables },
  { id: 'phonemes', name: 'phonemes', digits: 2, value: (i) => i.phonemes },
  { id: 'wcm', name: 'WCM', digits: 2, value: (i) => i.wcm },
  { id: 'zipfMean', name: 'mean Zipf', digits: 2, value: (i) => i.zipfMean },
  { id: 'zipfMin', name: 'min Zipf', digits: 2, value: (i) => i.zipfMin },
  { id: 'difficulty', name: 'difficulty', digits: 1, value: (i) => i.difficulty },
];

/** Each one-sided test of the equivalence check runs at this level (a 90 % interval). */
export const TOST_ALPHA = 0.05;

/**
 * One metric compared between sets A and B. Numbers that are undefined for the data (a t-test
 * of two constant sets) are null.
 */
export interface MetricComparison {
  nA: number;
  nB: number;
  meanA: number;
  meanB: number;
  sdA: number;
  sdB: number;
  /** meanA - meanB. */
  diff: number;
  /** Hedges' g (A minus B) with its approximate 95 % CI (Borenstein et al. 2009). */
  g: number | null;
  gLow: number | null;
  gHigh: number | null;
  welchT: number | null;
  welchDf: number | null;
  welchP: number | null;
  mwuU: number;
  mwuP: number;
  mwuMethod: MwuMethod;
  /** The bound in raw units: setBound × sqrt((sdA² + sdB²) / 2). */
  boundRaw: number;
  tostPLower: number | null;
  tostPUpper: number | null;
  /** The 90 % CI of the difference. */
  ciLow: number | null;
  ciHigh: number | null;
  /** Both one-sided tests reject at .05: the sets are shown equivalent on this metric. */
  equivalent: boolean;
  /**
   * How far the 90 % CI sits inside the bounds, in SD units (positive = equivalent). Two constant
   * sets count +bound when equal and -bound when not (no SD to scale by).
   */
  margin: number;
}

export interface SetPair {
  a: string;
  b: string;
  /** 0-based rung index when compared rung by rung; null for the whole script. */
  rung: number | null;
  rungName: string | null;
  /** 0-based lines of the items of each set. */
  linesA: number[];
  linesB: number[];
  metrics: Record<string, MetricComparison>;
  /** The smallest margin over the metrics (the balancer's objective). */
  worstMargin: number;
}

/** A set too small to compare (fewer than setMinItems items in the scope). */
export interface SmallSet {
  label: string;
  rung: number | null;
  rungName: string | null;
  n: number;
  lines: number[];
}

export interface SetComparison {
  scope: SetScope;
  /** Equivalence bound in SD units. */
  bound: number;
  minItems: number;
  /** Every label in force, in order of first appearance. */
  labels: string[];
  pairs: SetPair[];
  small: SmallSet[];
}

/** The labels of each item; the balancer passes a proposed assignment instead of the script's own. */
export type LabelsOf = (item: ItemAnalysis) => readonly string[];

/** The TOST of two summaries against ±bound SD (null when it is undefined), and its SD. */
function tostInSd(sa: Summary, sb: Summary, bound: number): { tost: TostResult | null; sd: number } {
  const sd = averageSd(sa, sb);
  return { tost: sd > 0 ? tostWelch(sa, sb, bound * sd, TOST_ALPHA) : null, sd };
}

/**
 * The equivalence margin of two summaries in SD units, exactly as compareMetric computes it; the
 * balancer calls this in its inner loop.
 */
export function metricMargin(sa: Summary, sb: Summary, bound: number): number {
  const { tost, sd } = tostInSd(sa, sb, bound);
  return tost ? tost.margin / sd : sa.mean === sb.mean ? bound : -bound;
}

export function compareMetric(a: readonly number[], b: readonly number[], bound: number): MetricComparison {
  const sa = summarize(a);
  const sb = summarize(b);
  const g = hedgesG(sa, sb);
  const w = welch(sa, sb);
  const { tost, sd } = tostInSd(sa, sb, bound);
  const boundRaw = bound * sd;
  const mwu = mannWhitney(a, b) ?? { u: NaN, p: NaN, method: 'normal' as const };
  const diff = sa.mean - sb.mean;
  const constantMatch = diff === 0;
  return {
    nA: sa.n,
    nB: sb.n,
    meanA: sa.mean,
    meanB: sb.mean,
    sdA: sa.sd,
    sdB: sb.sd,
    diff,
    g: g?.g ?? null,
    gLow: g?.low ?? null,
    gHigh: g?.high ?? null,
    welchT: w?.t ?? null,
    welchDf: w?.df ?? null,
    welchP: w?.p ?? null,
    mwuU: mwu.u,
    mwuP: mwu.p,
    mwuMethod: mwu.method,
    boundRaw,
    tostPLower: tost?.pLower ?? null,
    tostPUpper: tost?.pUpper ?? null,
    ciLow: tost?.ciLow ?? null,
    ciHigh: tost?.ciHigh ?? null,
    equivalent: tost ? tost.equivalent : constantMatch,
    margin: metricMargin(sa, sb, bound),
  };
}

/** The groups of items compared: the whole script, or each rung. */
export function setGroups(analysis: Analysis, scope: SetScope): { rung: number | null; items: ItemAnalysis[] }[] {
  if (scope === 'script') return [{ rung: null, items: analysis.items }];
  return analysis.rungs.map((r) => ({ rung: r.index, items: r.items }));
}

const ownLabels: LabelsOf = (i) => i.sets;

/** Labels in order of first appearance (the items' own labels unless `labelsOf` says otherwise). */
export function setLabels(analysis: Analysis, labelsOf: LabelsOf = ownLabels): string[] {
  const seen: string[] = [];
  if (labelsOf !== ownLabels) {
    for (const it of analysis.items) for (const l of labelsOf(it)) if (!seen.includes(l)) seen.push(l);
    return seen;
  }
  // The items' own labels, gathered per rung and kept with the rung's analysis (the set rules ask
  // on every edit; an edit reads only the rungs it touched).
  for (const r of analysis.rungs) for (const l of rungSetLabels(r)) if (!seen.includes(l)) seen.push(l);
  return seen;
}

const labelsByRung = new WeakMap<RungAnalysis, string[]>();

function rungSetLabels(r: RungAnalysis): string[] {
  let out = labelsByRung.get(r);
  if (!out) {
    out = [];
    let last: string[] | undefined;
    for (const it of r.items) {
      // Items of a rung mostly share one inherited list: read each list once in a row.
      if (it.sets === last) continue;
      last = it.sets;
      for (const l of it.sets) if (!out.includes(l)) out.push(l);
    }
    labelsByRung.set(r, out);
  }
  return out;
}

/**
 * Compares every pair of set labels on every metric. Options default to the script's own
 * (`@set-bound`, `@set-min-items`, `@set-scope`). This is the function reports render from.
 */
export function compareSets(analysis: Analysis, options: Partial<SetOptions> = {}, labelsOf: LabelsOf = ownLabels): SetComparison {
  const o: SetOptions = {
    setBound: options.setBound ?? analysis.options.setBound ?? DEFAULT_SET_OPTIONS.setBound,
    setMinItems: options.setMinItems ?? analysis.options.setMinItems ?? DEFAULT_SET_OPTIONS.setMinItems,
    setScope: options.setScope ?? analysis.options.setScope ?? DEFAULT_SET_OPTIONS.setScope,
  };
  const labels = setLabels(analysis, labelsOf);
  const pairs: SetPair[] = [];
  const small: SmallSet[] = [];
  if (labels.length < 2) return { scope: o.setScope, bound: o.setBound, minItems: o.setMinItems, labels, pairs, small };
  for (const group of setGroups(analysis, o.setScope)) {
    const rungName = group.rung === null ? null : analysis.rungs[group.rung].node.name;
    const members = new Map<string, ItemAnalysis[]>();
    for (const l of labels) members.set(l, group.items.filter((it) => labelsOf(it).includes(l)));
    const present = labels.filter((l) => members.get(l)!.length > 0);
    // A set alone in its rung has nothing to be matched with there.
    if (present.length < 2) continue;
    const testable = present.filter((l) => members.get(l)!.length >= o.setMinItems);
    for (const l of present) {
      const its = members.get(l)!;
      if (its.length < o.setMinItems) small.push({ label: l, rung: group.rung, rungName, n: its.length, lines: its.map((i) => i.node.line) });
    }
    for (let x = 0; x < testable.length; x++) {
      for (let y = x + 1; y < testable.length; y++) {
        const A = members.get(testable[x])!;
        const B = members.get(testable[y])!;
        const metrics: Record<string, MetricComparison> = {};
        let worst = Infinity;
        for (const m of SET_METRICS) {
          const c = compareMetric(A.map(m.value), B.map(m.value), o.setBound);
          metrics[m.id] = c;
          worst = Math.min(worst, c.margin);
        }
        pairs.push({
          a: testable[x],
          b: testable[y],
          rung: group.rung,
          rungName,
          linesA: A.map((i) => i.node.line),
          linesB: B.map((i) => i.node.line),
          metrics,
          worstMargin: worst,
        });
      }
    }
  }
  return { scope: o.setScope, bound: o.setBound, minItems: o.setMinItems, labels, pairs, small };
}
