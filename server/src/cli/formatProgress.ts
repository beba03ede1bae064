// Formatters for `rungs progress`: one result type in, one string out (table, CSV, JSON).
// Lines and columns are 1-based here, as people and tools read them.
import { stringify } from 'csv-stringify/sync';
import { CAUTION } from '../core/caution';
import { formatNumber } from '../core/pace';
import type { ProgressResult, RateRecord, Trend } from '../core/records';
import type { Problem } from '../core/types';

export interface ProgressFileResult extends ProgressResult {
  /** The records file as shown (relative to the working folder). */
  file: string;
}

const round = (n: number | null, d = 3): number | null => (n === null ? null : Number(n.toFixed(d)));

/** Where a paced row's unassisted rate came from: a date, "@baseline", or null. */
export function baselineFrom(r: RateRecord): string | null {
  const b = r.baseline;
  if (!b || b.from === 'none') return null;
  return b.from === 'script' ? '@baseline' : b.date;
}

function problemJson(p: Problem) {
  return { line: p.line + 1, column: p.character + 1, endLine: p.endLine + 1, endColumn: p.endCharacter + 1, severity: p.severity, rule: p.rule, message: p.message };
}

/** The documented JSON schema (README "rungs progress"). */
export function progressJson(f: ProgressFileResult): unknown {
  return {
    file: f.file,
    records: f.records.map((r) => ({
      line: r.line + 1,
      date: r.date,
      client: r.client,
      script: r.script,
      rung: r.rungName ?? r.rung,
      condition: r.condition,
      words: r.words,
      wordsFromTranscript: r.wordsFromTranscript,
      fillersLeftOut: r.fillersLeftOut,
      seconds: r.seconds,
      pace: r.pace?.label ?? null,
      wps: round(r.wps),
      sps: round(r.sps),
      ratio: round(r.ratio),
      baselineFrom: baselineFrom(r),
      baselineWps: r.baseline && r.baseline.from !== 'none' ? round(r.baseline.wps) : null,
      benefit: r.benefit,
      paceKept: round(r.paceKept),
      accuracy: round(r.accuracy),
    })),
    trends: f.trends.map((t) => ({
      client: t.client,
      script: t.script,
      rung: t.rung,
      sessions: t.sessions.length,
      dates: t.sessions.map((s) => s.date),
      ratios: t.ratios.map((x) => round(x)),
      slopePerWeek: round(t.slopePerWeek, 4),
      accuracySlopePerWeek: round(t.accuracySlopePerWeek, 4),
      atMark: t.atMark,
      ready: t.ready,
      note: t.note,
    })),
    problems: f.problems.map(problemJson),
  };
}

export function formatProgressJson(files: ProgressFileResult[], benefitMark: number): string {
  return `${JSON.stringify({ benefitMark, files: files.map(progressJson), caution: CAUTION }, null, 2)}\n`;
}

const n2 = (x: number | null): string => (x === null ? '–' : formatNumber(x, 2));

function ratioCell(r: RateRecord): string {
  if (r.condition !== 'paced') return '';
  if (r.ratio === null) return 'no unassisted rate';
  const from = baselineFrom(r);
  return `${n2(r.ratio)}${r.benefit ? ' ✓' : ''} (vs ${n2(r.baseline && r.baseline.from !== 'none' ? r.baseline.wps : null)} w/s, ${from === '@baseline' ? '@baseline' : from === r.date ? 'same day' : from})`;
}

function trendLine(t: Trend): string {
  const slope = t.slopePerWeek === null ? 'no slope yet' : `${t.slopePerWeek >= 0 ? '+' : ''}${formatNumber(t.slopePerWeek, 3)}/week`;
  return `  ${t.client} · ${t.script} · ${t.rung}: ratios ${t.ratios.map(n2).join(', ') || '–'} · ${slope} · ${t.note}`;
}

function pad(rows: string[][]): string[] {
  const widths = rows[0].map((_, i) => Math.max(...rows.map((r) => r[i].length)));
  return rows.map((r) => r.map((c, i) => c.padEnd(widths[i])).join('  ').trimEnd());
}

export function formatProgressTable(files: ProgressFileResult[], benefitMark: number): string {
  const out: string[] = [];
  for (const f of files) {
    out.push(`${f.file}: ${f.records.length} of ${f.rows} rows read; ✓ marks a ratio of ${formatNumber(benefitMark)} or more`);
    if (f.records.length) {
      const rows = [['line', 'date', 'client', 'rung', 'condition', 'words', 'seconds', 'w/s', 'ratio', 'pace kept']];
      for (const r of f.records) {
        rows.push([
          String(r.line + 1), r.date, r.client, r.rungName ?? '', r.condition, `${r.words}${r.wordsFromTranscript ? '*' : ''}`,
          formatNumber(r.seconds, 2), n2(r.wps), ratioCell(r), r.paceKept === null ? '' : `${formatNumber(r.paceKept * 100, 0)}% of ${r.pace!.label}`,
        ]);
      }
      out.push(...pad(rows).map((l) => `  ${l}`));
      if (f.records.some((r) => r.wordsFromTranscript)) out.push('  * counted from the transcript, fillers left out');
    }
    if (f.trends.length) out.push('', 'Trends', ...f.trends.map(trendLine));
    if (f.problems.length) {
      out.push('', 'Problems');
      for (const p of f.problems) out.push(`  ${f.file}:${p.line + 1}:${p.character + 1} ${p.severity} ${p.rule} ${p.message}`);
    }
    out.push('');
  }
  out.push(CAUTION, '');
  return out.join('\n');
}

/** One CSV row per record, for a spreadsheet; problems go to standard error. */
export function formatProgressCsv(files: ProgressFileResult[]): string {
  const header = ['file', 'line', 'date', 'client', 'script', 'rung', 'condition', 'words', 'seconds', 'pace', 'wps', 'ratio', 'baseline_from', 'benefit', 'pace_kept', 'accuracy'];
  const rows = files.flatMap((f) =>
    f.records.map((r) => [
      f.file, r.line + 1, r.date, r.client, r.script ?? '', r.rungName ?? '', r.condition, r.words, r.seconds, r.pace?.label ?? '',
      round(r.wps), round(r.ratio) ?? '', baselineFrom(r) ?? '', r.benefit === null ? '' : r.benefit ? 'yes' : 'no', round(r.paceKept) ?? '', round(r.accuracy) ?? '',
    ]),
  );
  return stringify([header, ...rows]);
}
