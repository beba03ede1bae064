// Formatters for `rungs score`: one result type in, one string out (table, CSV, JSON).
import { isEstimated } from '../core/pronounce';
import type { Analysis, ItemAnalysis, Pace, Problem } from '../core/types';
import { stringify } from 'csv-stringify/sync';
import { baselineRatio, fasterThanReadingWords, formatNumber } from '../core/pace';
import { CAUTION } from '../core/caution';
import { itemFacts } from '../report/model';
import { describeLengths, sessionLengths } from '../core/timing';
import { jsonPieces } from './jsonStream';
import { terminalSafe } from '../core/excerpt';

export interface ScoredFile {
  file: string;
  analysis: Analysis;
  problems: Problem[];
}

const round = (n: number, d: number) => Number(n.toFixed(d));

/** The documented JSON schema (README "JSON output"); lines and columns are 1-based. */
export function scoreJson(s: ScoredFile): unknown {
  const { analysis } = s;
  const title = analysis.script.header.find((h) => h.key === 'title')?.value ?? null;
  const session = sessionLengths(analysis);
  const bySeconds = (list: { pace: Pace; seconds: number }[]) => Object.fromEntries(list.map((p) => [p.pace.label, round(p.seconds, 2)]));
  return {
    file: s.file,
    title,
    paces: analysis.options.paces.map((p) => p.label),
    baseline: analysis.options.baseline,
    sessionSeconds: bySeconds(session.script),
    rungs: analysis.rungs.map((r) => ({
      name: r.node.name,
      line: r.node.line + 1,
      paces: r.paces.map((p) => p.label),
      sets: r.node.sets,
      median: r.median,
      min: r.min,
      max: r.max,
      totalSeconds: Object.fromEntries(r.paces.map((p, i) => [p.label, round(r.totalSeconds[i], 2)])),
      sessionSeconds: bySeconds(session.rungs[r.index].paces),
      paceFacts: Object.fromEntries(r.paces.map((p) => [p.label, paceFacts(analysis, p)])),
      items: r.items.map((it) => itemJson(it)),
    })),
    problems: s.problems.map((p) => ({
      line: p.line + 1,
      column: p.character + 1,
      endLine: p.endLine + 1,
      endColumn: p.endCharacter + 1,
      severity: p.severity,
      rule: p.rule,
      message: p.message,
    })),
    caution: CAUTION,
  };
}

/**
 * Facts about a pace itself: its ratio to the client's baseline (word paces; null without a
 * baseline) and whether it is faster than adult reading aloud (Brysbaert 2019, 3.05 words/s).
 */
function paceFacts(a: Analysis, p: Pace): { baselineRatio: number | null; aboveReadingNorm: boolean | null } {
  if (p.unit !== 'wps') return { baselineRatio: null, aboveReadingNorm: null };
  return {
    baselineRatio: a.options.baseline ? round(baselineRatio(p.value, a.options.baseline)!, 3) : null,
    aboveReadingNorm: fasterThanReadingWords(p.value, a.options.readingNormWps),
  };
}

function paceNote(a: Analysis, p: Pace): string {
  const f = paceFacts(a, p);
  const bits = [];
  if (f.baselineRatio !== null) bits.push(`${formatNumber(f.baselineRatio)}× baseline`);
  if (f.aboveReadingNorm) bits.push('above reading-aloud rate');
  return bits.length ? ` (${bits.join(', ')})` : '';
}

function itemJson(it: ItemAnalysis): unknown {
  return {
    ...itemFacts(it),
    zipfMean: round(it.zipfMean, 4),
    zipfMin: round(it.zipfMin, 4),
    lowFrequencyWords: it.lowFrequencyWords,
    estimatedWords: it.estimatedWords,
    difficulty: it.difficulty,
    rank: it.rank,
    durations: Object.fromEntries(it.timings.map((t) => [t.pace.label, round(t.seconds, 3)])),
    syllableRates: Object.fromEntries(it.timings.map((t) => [t.pace.label, round(t.syllableRate, 3)])),
    estimates: it.words
      .filter((w) => isEstimated(w))
      .map((w) => ({ word: w.spoken, phones: w.phones.join(' '), source: w.source })),
  };
}

export function formatJson(files: ScoredFile[]): string {
  return [...formatJsonPieces(files)].join('');
}

/** The JSON output in pieces, for writing results too large to hold as one string. */
export function* formatJsonPieces(files: ScoredFile[]): Generator<string> {
  if (files.length === 1) yield* jsonPieces(scoreJson(files[0]));
  else {
    // One file's data at a time, so only that file's JSON objects are alive at once.
    yield files.length ? '[' : '[]';
    for (let i = 0; i < files.length; i++) {
      yield `${i ? ',' : ''}\n  `;
      yield* jsonPieces(scoreJson(files[i]), '  ');
    }
    if (files.length) yield '\n]';
  }
  yield '\n';
}

/** One row per item; duration columns are the union of the paces in the files, in first-seen order. */
export function formatCsv(files: ScoredFile[]): string {
  const paceLabels: string[] = [];
  for (const f of files) for (const r of f.analysis.rungs) for (const p of r.paces) if (!paceLabels.includes(p.label)) paceLabels.push(p.label);
  const head = ['file', 'rung', 'line', 'id', 'sets', 'text', 'words', 'syllables', 'phonemes', 'wcm', 'zipf_mean', 'zipf_min', 'low_frequency_words', 'estimated_words', 'difficulty', 'rank', ...paceLabels.map((l) => `seconds_at_${l.replace(' ', '_')}`)];
  const rows: (string | number | null)[][] = [head];
  for (const f of files) {
    for (const r of f.analysis.rungs) {
      for (const it of r.items) {
        const byLabel = new Map(it.timings.map((t) => [t.pace.label, round(t.seconds, 3)]));
        rows.push([f.file, r.node.name, it.node.line + 1, it.node.id, it.sets.join(' '), it.node.text, it.wordCount, it.syllables, it.phonemes, it.wcm, round(it.zipfMean, 4), round(it.zipfMin, 4), it.lowFrequencyWords, it.estimatedWords, it.difficulty, it.rank, ...paceLabels.map((l) => byLabel.get(l) ?? null)]);
      }
    }
  }
  // csv-stringify quotes as RFC 4180 asks, and escape_formulas puts a ' before a text cell that
  // starts with =, +, -, @ (an item may), so a spreadsheet shows it instead of running it.
  return stringify(rows, { escape_formulas: true, record_delimiter: 'unix' });
}

function pad(s: string, width: number, right = false): string {
  const n = [...s].length;
  if (n >= width) return s;
  return right ? ' '.repeat(width - n) + s : s + ' '.repeat(width - n);
}

/** An aligned table for people: a block per file, a header per rung, one row per item. */
export function formatTable(files: ScoredFile[], caution: string): string {
  const out: string[] = [];
  for (const f of files) {
    const a = f.analysis;
    const title = a.script.header.find((h) => h.key === 'title')?.value;
    const base = a.options.baseline ? `; baseline ${formatNumber(a.options.baseline)} wps` : '';
    out.push(`${terminalSafe(f.file)}${title ? ` — ${terminalSafe(title)}` : ''}  (paces ${a.options.paces.map((p) => p.label).join(', ')}${base})`);
    const session = sessionLengths(a);
    for (const r of a.rungs) {
      const cols = ['line', 'words', 'syl', 'phon', 'WCM', 'Zipf mean', 'Zipf min', 'diff', 'rank', ...r.paces.map((p) => `s@${p.label}`)];
      const rows = r.items.map((it) => [
        String(it.node.line + 1),
        String(it.wordCount),
        String(it.syllables),
        String(it.phonemes),
        String(it.wcm),
        it.zipfMean.toFixed(2),
        it.zipfMin.toFixed(2),
        it.difficulty.toFixed(1),
        String(it.rank),
        ...it.timings.map((t) => t.seconds.toFixed(1)),
      ]);
      const widths = cols.map((c, i) => rows.reduce((w, row) => Math.max(w, row[i].length), c.length));
      const paceNotes = r.paces
        .map((p, i) => `${formatNumber(r.totalSeconds[i], 1)} s at ${p.label}${paceNote(a, p)}`)
        .join(', ');
      out.push('');
      out.push(`  == ${terminalSafe(r.node.name)} (line ${r.node.line + 1}): ${r.items.length} item${r.items.length === 1 ? '' : 's'}, median ${r.median.toFixed(1)}, range ${r.min.toFixed(1)}-${r.max.toFixed(1)}; total ${paceNotes || '—'}`);
      if (r.items.length) out.push(`     session with ${a.options.timing.gap} s gaps: ${describeLengths(session.rungs[r.index].paces)}`);
      out.push(`    ${cols.map((c, i) => pad(c, widths[i], true)).join('  ')}  text`);
      r.items.forEach((it, k) => {
        const est = it.words.filter((w) => isEstimated(w)).map((w) => w.spoken);
        const mark = est.length ? `   [estimated: ${terminalSafe([...new Set(est)].join(', '))}]` : '';
        out.push(`    ${rows[k].map((c, i) => pad(c, widths[i], true)).join('  ')}  ${terminalSafe(it.node.text)}${mark}`);
      });
    }
    if (a.items.length) out.push('', `  whole script with ${a.options.timing.gap} s gaps: ${describeLengths(session.script)}`);
    const fast = a.options.paces.filter((p) => p.unit === 'wps' && fasterThanReadingWords(p.value, a.options.readingNormWps));
    if (fast.length) out.push('', `  note: ${fast.map((p) => p.label).join(', ')} is faster than adult reading aloud (${formatNumber(a.options.readingNormWps)} wps, Brysbaert 2019)`);
    if (f.problems.length) {
      out.push('', `  ${f.problems.length} problem${f.problems.length === 1 ? '' : 's'}:`);
      for (const p of f.problems) out.push(`    ${p.line + 1}:${p.character + 1}  ${p.severity}  ${p.rule}  ${terminalSafe(p.message)}`);
    }
    out.push('');
  }
  out.push(caution);
  return `${out.join('\n')}\n`;
}
