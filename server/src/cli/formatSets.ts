// Renderers of `rungs sets`: one SetComparison per file in, text out (table, CSV, JSON).
import { CAUTION } from '../core/caution';
import type { BalanceResult } from '../core/balance';
import type { Problem } from '../core/types';
import { SET_METRICS, type SetComparison, type SetPair } from '../core/sets';
import { BALANCE_COLUMNS, balanceRows, pairTitle } from '../core/setTable';

export interface SetsFile {
  file: string;
  comparison: SetComparison;
  /** The set rules' problems (unmatched sets, small sets), 0-based positions. */
  problems: Problem[];
}

const round = (n: number | null, d = 6): number | null => (n === null || Number.isNaN(n) ? null : Number(n.toFixed(d)));

function pairJson(p: SetPair): unknown {
  const metrics: Record<string, unknown> = {};
  for (const m of SET_METRICS) {
    const x = p.metrics[m.id];
    if (!x) continue;
    metrics[m.id] = {
      nA: x.nA, nB: x.nB, meanA: round(x.meanA), meanB: round(x.meanB), sdA: round(x.sdA), sdB: round(x.sdB),
      g: round(x.g), gLow: round(x.gLow), gHigh: round(x.gHigh),
      welchT: round(x.welchT), welchDf: round(x.welchDf), welchP: round(x.welchP),
      mwuU: round(x.mwuU), mwuP: round(x.mwuP), mwuMethod: x.mwuMethod,
      tostPLower: round(x.tostPLower), tostPUpper: round(x.tostPUpper),
      ciLow: round(x.ciLow), ciHigh: round(x.ciHigh), bound: round(x.boundRaw),
      equivalent: x.equivalent,
    };
  }
  return { a: p.a, b: p.b, rung: p.rung === null ? null : p.rung + 1, rungName: p.rungName, metrics };
}

export function setsJson(f: SetsFile): unknown {
  const c = f.comparison;
  return {
    file: f.file,
    scope: c.scope,
    bound: c.bound,
    minItems: c.minItems,
    labels: c.labels,
    pairs: c.pairs.map(pairJson),
    smallSets: c.small.map((s) => ({ label: s.label, rung: s.rung === null ? null : s.rung + 1, n: s.n, lines: s.lines.map((l) => l + 1) })),
    problems: f.problems.map((p) => ({ rule: p.rule, severity: p.severity, line: p.line + 1, column: p.character + 1, message: p.message })),
    caution: CAUTION,
  };
}

export function formatSetsJson(files: SetsFile[]): string {
  return `${JSON.stringify(files.length === 1 ? setsJson(files[0]) : files.map(setsJson), null, 2)}\n`;
}

function csvCell(v: string | number | boolean | null): string {
  const s = v === null ? '' : String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** One row per file, pair and metric. */
export function formatSetsCsv(files: SetsFile[]): string {
  const head = ['file', 'scope', 'rung', 'a', 'b', 'metric', 'n_a', 'n_b', 'mean_a', 'mean_b', 'sd_a', 'sd_b', 'g', 'g_low', 'g_high', 'welch_t', 'welch_df', 'welch_p', 'mwu_u', 'mwu_p', 'mwu_method', 'tost_p_lower', 'tost_p_upper', 'ci90_low', 'ci90_high', 'bound', 'equivalent'];
  const rows = [head.join(',')];
  for (const f of files) {
    for (const p of f.comparison.pairs) {
      for (const m of SET_METRICS) {
        const x = p.metrics[m.id];
        if (!x) continue;
        rows.push(
          [f.file, f.comparison.scope, p.rung === null ? null : p.rung + 1, p.a, p.b, m.id, x.nA, x.nB, round(x.meanA), round(x.meanB), round(x.sdA), round(x.sdB), round(x.g), round(x.gLow), round(x.gHigh), round(x.welchT), round(x.welchDf), round(x.welchP), round(x.mwuU), round(x.mwuP), x.mwuMethod, round(x.tostPLower), round(x.tostPUpper), round(x.ciLow), round(x.ciHigh), round(x.boundRaw), x.equivalent]
            .map(csvCell)
            .join(','),
        );
      }
    }
  }
  return `${rows.join('\n')}\n`;
}

function pad(s: string, width: number): string {
  const n = [...s].length;
  return n >= width ? s : s + ' '.repeat(width - n);
}

/** The balance tables of one comparison, indented, for people. */
export function balanceTableText(c: SetComparison, indent = '  '): string[] {
  const out: string[] = [];
  for (const p of c.pairs) {
    const rows = balanceRows(p);
    const cells = [BALANCE_COLUMNS.map((col) => col.title), ...rows.map((r) => BALANCE_COLUMNS.map((col) => r[col.key]))];
    const widths = BALANCE_COLUMNS.map((_, i) => Math.max(...cells.map((row) => [...row[i]].length)));
    const shown = rows.filter((r) => r.verdict === 'equivalent').length;
    out.push('', `${indent}${pairTitle(p)} (A = ${p.a}, B = ${p.b}): ${shown} of ${rows.length} metrics shown equivalent within ±${c.bound} SD`);
    for (const row of cells) out.push(`${indent}  ${row.map((s, i) => pad(s, widths[i])).join('  ').trimEnd()}`);
  }
  for (const s of c.small) {
    const where = s.rung === null ? 'in the script' : `in rung ${s.rung + 1} "${s.rungName}"`;
    out.push('', `${indent}set "${s.label}" has ${s.n} item${s.n === 1 ? '' : 's'} ${where}: too few to compare (@set-min-items ${c.minItems})`);
  }
  return out;
}

export function formatSetsTable(files: SetsFile[]): string {
  const out: string[] = [];
  for (const f of files) {
    const c = f.comparison;
    out.push(`${f.file}  (sets ${c.labels.length ? c.labels.join(', ') : 'none'}; compared ${c.scope === 'script' ? 'over the whole script' : 'rung by rung'})`);
    if (c.labels.length < 2) out.push('  fewer than two set labels: nothing to compare (label items with "| @set trained" and "| @set untrained")');
    else if (!c.pairs.length && !c.small.length) out.push('  no rung holds two sets to compare');
    out.push(...balanceTableText(c));
    out.push('');
  }
  out.push('Equivalence: two one-sided Welch tests (TOST, alpha .05 each, 90 % CI) against ±bound × sqrt((SD_A² + SD_B²) / 2).');
  out.push('A non-significant t or U alone does not show that sets are matched.');
  out.push(CAUTION);
  return `${out.join('\n')}\n`;
}

export interface BalancedFile {
  file: string;
  result: BalanceResult;
  /** The proposal was written into the file (--fix). */
  written: boolean;
  /** Time the search took, in milliseconds (shown to people, left out of JSON so it stays stable). */
  ms: number;
}

const margin = (n: number): string => (Number.isFinite(n) ? n.toFixed(3) : '—');

/** The balancer's proposal: changes, worst margin before and after, and both sets of tables. */
export function formatBalance(files: BalancedFile[], format: string): string {
  if (format === 'json') {
    const one = (f: BalancedFile) => ({
      file: f.file,
      seed: f.result.seed,
      iterations: f.result.iterations,
      movable: f.result.movable,
      worstMarginBefore: Number.isFinite(f.result.worstBefore) ? round(f.result.worstBefore) : null,
      worstMarginAfter: Number.isFinite(f.result.worstAfter) ? round(f.result.worstAfter) : null,
      changes: f.result.changes.map((c) => ({ line: c.line + 1, from: c.from, to: c.to })),
      written: f.written,
      before: setsJson({ file: f.file, comparison: f.result.before, problems: [] }),
      after: setsJson({ file: f.file, comparison: f.result.after, problems: [] }),
    });
    return `${JSON.stringify(files.length === 1 ? one(files[0]) : files.map(one), null, 2)}\n`;
  }
  if (format === 'csv') {
    const rows = ['file,line,from,to'];
    for (const f of files) for (const c of f.result.changes) rows.push([f.file, c.line + 1, c.from, c.to].map(csvCell).join(','));
    return `${rows.join('\n')}\n`;
  }
  const out: string[] = [];
  for (const f of files) {
    const r = f.result;
    out.push(`${f.file}  (seed ${r.seed}; ${r.iterations} moves over ${r.movable} movable items in ${Math.round(f.ms)} ms)`);
    if (!r.changes.length) {
      out.push(
        r.movable < 2
          ? '  nothing to balance: no rung has items of two sets with their own @set label'
          : !r.before.pairs.length
            ? `  nothing to balance: no two sets are large enough to compare (@set-min-items ${r.before.minItems})`
            : '  no better split found: the labels stay as they are',
      );
      out.push(...balanceTableText(r.before));
    } else {
      out.push(`  worst equivalence margin ${margin(r.worstBefore)} -> ${margin(r.worstAfter)} SD (positive = shown equivalent on every metric)`);
      out.push(`  ${r.changes.length} label${r.changes.length === 1 ? '' : 's'} ${f.written ? 'changed' : 'to change (run again with --fix to write them)'}:`);
      for (const c of r.changes) out.push(`    line ${c.line + 1}: ${c.from} -> ${c.to}`);
      out.push('', '  Before:', ...balanceTableText(r.before, '    '), '', '  After:', ...balanceTableText(r.after, '    '));
    }
    out.push('');
  }
  out.push('The balancer swaps @set labels between items of the same rung (Armstrong, Watson & Plaut 2012: stochastic search);');
  out.push('it changes nothing else. Check the proposal: matching on numbers does not replace matching on baseline accuracy.');
  out.push(CAUTION);
  return `${out.join('\n')}\n`;
}
