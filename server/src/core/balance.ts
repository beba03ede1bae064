// The set balancer: proposes which items carry which `@set` label so that the sets are matched on
// every metric at once. It maximises the worst equivalence margin (the 90 % CI's distance inside
// ±bound SD, over every metric and pair of sets compared) by a seeded stochastic search over
// label swaps, in the manner of the stochastic optimisation of stimuli of Armstrong, Watson &
// Plaut (2012, Behavior Research Methods 44(4)): simulated annealing with a falling temperature,
// keeping the best assignment seen.
//
// What it implements, exactly: a move swaps the labels of two items of one rung that carry
// different labels, so every rung keeps its items and each set keeps its size per rung. Only
// items whose own line carries exactly one `@set` label move (labels inherited from a header stay
// put). The search is deterministic for a seed and runs a fixed number of moves; afterwards every
// pair of changes that the worst margin does not need is undone. The result is
// never worse than the input: the input assignment is a candidate, and the final choice is
// re-checked with the same comparison the tables show.
import { studentt } from 'jstat';
import { splitLines } from './parse';
import { compareSets, metricMargin, SET_METRICS, setGroups, setLabels, TOST_ALPHA, type SetComparison } from './sets';
import { relabelEdit } from './setLabels';
import type { SetOptions } from './setOptions';
import type { Summary } from './stats';
import type { Analysis, ItemAnalysis, TextEdit } from './types';

export interface BalanceOptions extends Partial<SetOptions> {
  /** Seed of the search (default 1): the same seed gives the same proposal. */
  seed?: number;
  /** Moves tried; default 100 per movable item, between 1,000 and 20,000. */
  iterations?: number;
  /** 0-based rungs whose labels may change (default: every rung). */
  rungs?: number[];
}

export interface BalanceChange {
  /** 0-based line of the item. */
  line: number;
  from: string;
  to: string;
}

export interface BalanceResult {
  seed: number;
  iterations: number;
  /** Items whose label the search could move. */
  movable: number;
  before: SetComparison;
  after: SetComparison;
  /** The worst margin (SD units) over the pairs the search could change, before and after. */
  worstBefore: number;
  worstAfter: number;
  changes: BalanceChange[];
  /** Edits of the label text only, one per changed item. */
  edits: TextEdit[];
}

/** mulberry32: a small, fast, seeded generator; plenty for choosing moves. */
export function seededRandom(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface Group {
  items: number[];
  /** Per label: n, and per metric the sum and sum of squares of the (centred) values. */
  n: number[];
  sum: number[][];
  sq: number[][];
  score: number;
  mean: number;
}

// The t quantile of the 90 % interval by degrees of freedom rounded to 0.01: the search calls it
// hundreds of thousands of times, and the final proposal is re-checked exactly anyway.
const quantiles = new Map<number, number>();
function tQuantile(df: number): number {
  const key = Math.round(df * 100);
  let q = quantiles.get(key);
  if (q === undefined) {
    q = studentt.inv(1 - TOST_ALPHA, Math.max(key, 1) / 100);
    quantiles.set(key, q);
  }
  return q;
}

/**
 * metricMargin without p-values: the margin needs only the interval, bound·sd - (|diff| + q·se),
 * in SD units (max(|low|, |high|) of an interval around diff is |diff| + q·se).
 */
function fastMargin(sa: Summary, sb: Summary, bound: number): number {
  const sd = Math.sqrt((sa.sd * sa.sd + sb.sd * sb.sd) / 2);
  const va = (sa.sd * sa.sd) / sa.n;
  const vb = (sb.sd * sb.sd) / sb.n;
  const df = ((va + vb) * (va + vb)) / ((va * va) / (sa.n - 1) + (vb * vb) / (sb.n - 1));
  if (!(sd > 0) || !Number.isFinite(df)) return metricMargin(sa, sb, bound);
  const se = Math.sqrt(va + vb);
  return (bound * sd - (Math.abs(sa.mean - sb.mean) + tQuantile(df) * se)) / sd;
}

/** The worst margin over the pairs of one group, and the mean margin (to break ties on plateaus). */
function groupScore(g: Group, testable: (n: number) => boolean, labels: number, bound: number, offsets: number[]): { score: number; mean: number } {
  let worst = Infinity;
  let total = 0;
  let count = 0;
  for (let x = 0; x < labels; x++) {
    if (!testable(g.n[x])) continue;
    for (let y = x + 1; y < labels; y++) {
      if (!testable(g.n[y])) continue;
      for (let m = 0; m < offsets.length; m++) {
        const sa = summaryOf(g.n[x], g.sum[m][x], g.sq[m][x], offsets[m]);
        const sb = summaryOf(g.n[y], g.sum[m][y], g.sq[m][y], offsets[m]);
        const margin = fastMargin(sa, sb, bound);
        worst = Math.min(worst, margin);
        total += margin;
        count++;
      }
    }
  }
  return { score: worst, mean: count ? total / count : 0 };
}

function summaryOf(n: number, sum: number, sq: number, offset: number): Summary {
  const mean = sum / n;
  // Values are centred on the metric's overall mean, which keeps this one-pass variance accurate.
  const variance = Math.max(0, (sq - sum * mean) / (n - 1));
  const sd = Math.sqrt(variance) < 1e-12 ? 0 : Math.sqrt(variance);
  return { n, mean: mean + offset, sd };
}

export function balanceSets(analysis: Analysis, text: string, options: BalanceOptions = {}): BalanceResult {
  const o: SetOptions = {
    setBound: options.setBound ?? analysis.options.setBound,
    setMinItems: options.setMinItems ?? analysis.options.setMinItems,
    setScope: options.setScope ?? analysis.options.setScope,
  };
  const seed = options.seed ?? 1;
  const lines = splitLines(text);
  const items = analysis.items;
  const labels = setLabels(analysis);
  const index = new Map(items.map((it, i) => [it, i]));
  const allowed = options.rungs ? new Set(options.rungs) : null;
  // Label indices per item: the current assignment (movable items hold exactly one).
  const assign: number[][] = items.map((it) => it.sets.map((l) => labels.indexOf(l)));
  const movable = items.map(
    (it) =>
      it.node.sets.length === 1 &&
      it.sets.length === 1 &&
      (!allowed || allowed.has(it.rung)) &&
      relabelEdit(lines[it.node.line] ?? '', it.node, it.sets[0]) !== null,
  );
  const values = SET_METRICS.map((m) => items.map((it) => m.value(it)));
  const offsets = values.map((v) => (v.length ? v.reduce((a, b) => a + b, 0) / v.length : 0));

  // Pairs of items that may swap are in one rung and carry different labels; list per rung.
  const byRung = new Map<number, number[]>();
  items.forEach((it, i) => {
    if (!movable[i]) return;
    const list = byRung.get(it.rung) ?? [];
    list.push(i);
    byRung.set(it.rung, list);
  });
  const candidates = [...byRung.values()].filter((list) => new Set(list.map((i) => assign[i][0])).size > 1).flat();
  const movableCount = candidates.length;
  const iterations = options.iterations ?? Math.min(20_000, Math.max(1_000, 100 * movableCount));
  const before = compareSets(analysis, o);
  const identity = (): BalanceResult => ({
    seed, iterations: 0, movable: movableCount, before, after: before, worstBefore: worstOf(before), worstAfter: worstOf(before), changes: [], edits: [],
  });
  // Only the pairs the moves can change count: those of the groups holding a movable item.
  const touched = new Set(candidates.map((i) => (o.setScope === 'script' ? -1 : items[i].rung)));
  const worstOf = (c: SetComparison): number =>
    Math.min(Infinity, ...c.pairs.filter((p) => touched.has(p.rung ?? -1)).map((p) => p.worstMargin));
  if (labels.length < 2 || movableCount < 2) return identity();

  const testable = (n: number) => n >= o.setMinItems;
  const groupOf = new Map<number, Group>();
  const groups: Group[] = [];
  for (const g of setGroups(analysis, o.setScope)) {
    const key = g.rung ?? -1;
    if (!touched.has(key)) continue;
    const group: Group = {
      items: g.items.map((it) => index.get(it)!),
      n: labels.map(() => 0),
      sum: SET_METRICS.map(() => labels.map(() => 0)),
      sq: SET_METRICS.map(() => labels.map(() => 0)),
      score: 0,
      mean: 0,
    };
    for (const i of group.items) {
      for (const l of assign[i]) {
        group.n[l]++;
        values.forEach((v, m) => {
          const x = v[i] - offsets[m];
          group.sum[m][l] += x;
          group.sq[m][l] += x * x;
        });
      }
    }
    Object.assign(group, groupScore(group, testable, labels.length, o.setBound, offsets));
    groups.push(group);
    for (const i of group.items) groupOf.set(i, group);
  }
  const total = () => {
    let worst = Infinity;
    let mean = 0;
    for (const g of groups) {
      worst = Math.min(worst, g.score);
      mean += g.mean / groups.length;
    }
    return { worst, mean };
  };
  const move = (g: Group, i: number, from: number, to: number) => {
    g.n[from]--;
    g.n[to]++;
    values.forEach((v, m) => {
      const x = v[i] - offsets[m];
      g.sum[m][from] -= x;
      g.sq[m][from] -= x * x;
      g.sum[m][to] += x;
      g.sq[m][to] += x * x;
    });
  };

  const random = seededRandom(seed);
  let current = total();
  let best = { ...current, assign: assign.map((a) => a[0]) };
  const t0 = 0.1;
  const t1 = 0.001;
  for (let k = 0; k < iterations; k++) {
    const i = candidates[Math.floor(random() * candidates.length)];
    const peers = byRung.get(items[i].rung)!.filter((j) => assign[j][0] !== assign[i][0]);
    if (!peers.length) continue;
    const j = peers[Math.floor(random() * peers.length)];
    const g = groupOf.get(i)!;
    const [li, lj] = [assign[i][0], assign[j][0]];
    const saved = { score: g.score, mean: g.mean };
    move(g, i, li, lj);
    move(g, j, lj, li);
    Object.assign(g, groupScore(g, testable, labels.length, o.setBound, offsets));
    const next = total();
    // Annealing on the worst margin with the mean margin as a small second term.
    const delta = next.worst - current.worst + 0.1 * (next.mean - current.mean);
    const temperature = t0 * Math.pow(t1 / t0, k / iterations);
    if (delta >= 0 || random() < Math.exp(delta / temperature)) {
      assign[i] = [lj];
      assign[j] = [li];
      current = next;
      if (next.worst > best.worst || (next.worst === best.worst && next.mean > best.mean)) {
        best = { ...next, assign: assign.map((a) => a[0]) };
      }
    } else {
      move(g, i, lj, li);
      move(g, j, li, lj);
      Object.assign(g, saved);
    }
  }

  // Go to the best assignment seen, then undo every pair of changes the worst margin does not need:
  // the search wanders across equally good splits, and each label changed is one a person must
  // check.
  items.forEach((_, i) => {
    if (movable[i] && assign[i][0] !== best.assign[i]) {
      move(groupOf.get(i)!, i, assign[i][0], best.assign[i]);
      assign[i] = [best.assign[i]];
    }
  });
  for (const g of groups) Object.assign(g, groupScore(g, testable, labels.length, o.setBound, offsets));
  const written = items.map((it) => labels.indexOf(it.sets[0]));
  for (const list of byRung.values()) {
    for (const i of list) {
      for (const j of list) {
        const li = assign[i][0];
        const lj = assign[j][0];
        // i and j trade back only when that returns both to their written labels.
        if (li === written[i] || lj === written[j] || li !== written[j] || lj !== written[i]) continue;
        const g = groupOf.get(i)!;
        const saved = { score: g.score, mean: g.mean };
        move(g, i, li, lj);
        move(g, j, lj, li);
        Object.assign(g, groupScore(g, testable, labels.length, o.setBound, offsets));
        const next = total();
        if (next.worst >= best.worst) {
          assign[i] = [lj];
          assign[j] = [li];
          best = { ...next, assign: assign.map((a) => a[0]) };
        } else {
          move(g, i, lj, li);
          move(g, j, li, lj);
          Object.assign(g, saved);
        }
      }
    }
  }

  const proposed = new Map<ItemAnalysis, string[]>();
  const changes: BalanceChange[] = [];
  const edits: TextEdit[] = [];
  items.forEach((it, i) => {
    if (!movable[i]) return;
    const to = labels[best.assign[i]];
    if (to === it.sets[0]) return;
    proposed.set(it, [to]);
    changes.push({ line: it.node.line, from: it.sets[0], to });
    edits.push(relabelEdit(lines[it.node.line], it.node, to)!);
  });
  if (!changes.length) return { ...identity(), iterations };
  const after = compareSets(analysis, o, (it) => proposed.get(it) ?? it.sets);
  // The exact comparison has the last word: a proposal that is not better is no proposal.
  if (!(worstOf(after) > worstOf(before))) return { ...identity(), iterations };
  return { seed, iterations, movable: movableCount, before, after, worstBefore: worstOf(before), worstAfter: worstOf(after), changes, edits };
}
