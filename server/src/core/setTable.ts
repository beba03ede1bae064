// The balance table of one pair of sets as rows of display strings, shared by the CLI table,
// the editor hover and reports so they all show the same numbers the same way.
import { SET_METRICS, type MetricComparison, type SetPair } from './sets';

export interface BalanceRow {
  metric: string;
  /** "n 9 · 3.22 ± 1.56" */
  a: string;
  b: string;
  /** meanA - meanB */
  diff: string;
  /** "0.35 [-0.61, 1.31]" */
  g: string;
  /** "t(14.9) = 0.71, p = .49" */
  welch: string;
  /** "U = 43, p = .61 exact" */
  mwu: string;
  /** "p = .31 / .12" (lower / upper one-sided tests) */
  tost: string;
  /** "[-1.2, 2.3]" (90 % CI of the difference) */
  ci90: string;
  verdict: 'equivalent' | 'not shown equivalent';
}

export const BALANCE_COLUMNS: { key: keyof BalanceRow; title: string }[] = [
  { key: 'metric', title: 'metric' },
  { key: 'a', title: 'A: n · mean ± SD' },
  { key: 'b', title: 'B: n · mean ± SD' },
  { key: 'diff', title: 'A - B' },
  { key: 'g', title: "Hedges' g [95 % CI]" },
  { key: 'welch', title: 'Welch t' },
  { key: 'mwu', title: 'Mann-Whitney U' },
  { key: 'tost', title: 'TOST p (lower / upper)' },
  { key: 'ci90', title: '90 % CI of A - B' },
  { key: 'verdict', title: 'verdict' },
];

/** "p = .030", "p < .001": a p-value in a sentence. */
export function pIs(p: number | null): string {
  const s = formatP(p);
  return s.startsWith('<') ? `p ${s.replace('<', '< ')}` : `p = ${s}`;
}

/** p-values as people read them: ".049", "<.001", "1". */
export function formatP(p: number | null): string {
  if (p === null || Number.isNaN(p)) return '—';
  if (p < 0.001) return '<.001';
  if (p >= 0.9995) return '1';
  return p.toFixed(3).replace(/^0/, '');
}

function num(n: number | null, digits: number): string {
  if (n === null || Number.isNaN(n)) return '—';
  const s = n.toFixed(digits);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

export function balanceRow(name: string, c: MetricComparison, digits: number): BalanceRow {
  return {
    metric: name,
    a: `n ${c.nA} · ${num(c.meanA, digits)} ± ${num(c.sdA, digits)}`,
    b: `n ${c.nB} · ${num(c.meanB, digits)} ± ${num(c.sdB, digits)}`,
    diff: num(c.diff, digits),
    g: c.g === null ? '—' : `${num(c.g, 2)} [${num(c.gLow, 2)}, ${num(c.gHigh, 2)}]`,
    welch: c.welchT === null ? '—' : `t(${num(c.welchDf, 1)}) = ${num(c.welchT, 2)}, ${pIs(c.welchP)}`,
    mwu: `U = ${num(c.mwuU, c.mwuU % 1 ? 1 : 0)}, ${pIs(c.mwuP)} ${c.mwuMethod}`,
    tost: c.tostPLower === null ? '—' : `${formatP(c.tostPLower)} / ${formatP(c.tostPUpper)}`,
    ci90: c.ciLow === null ? '—' : `[${num(c.ciLow, digits)}, ${num(c.ciHigh, digits)}]`,
    verdict: c.equivalent ? 'equivalent' : 'not shown equivalent',
  };
}

/** One row per metric of the metric table, in its order. */
export function balanceRows(pair: SetPair): BalanceRow[] {
  return SET_METRICS.filter((m) => pair.metrics[m.id]).map((m) => balanceRow(m.name, pair.metrics[m.id], m.digits));
}

/** "trained vs untrained, whole script" or "... in rung 2 \"Short requests\"". */
export function pairTitle(pair: SetPair): string {
  const where = pair.rung === null ? 'whole script' : `rung ${pair.rung + 1} "${pair.rungName}"`;
  return `${pair.a} vs ${pair.b}, ${where}`;
}
