// From validated rows to what a clinician reads: per row the rate, the ratio to the client's
// unassisted rate, the benefit mark and how closely the model's pace was kept; per client and rung
// the sessions, the ratio trend (least-squares slope per week) and a readiness note. Everything is
// plain data; the CLI, the language server, the progress view and reports render it.
import { linearRegression } from 'simple-statistics';
import { formatNumber } from '../pace';
import type { Finding } from '../findings';
import type { WordData } from '../types';
import { readCsv } from './csv';
import { add, cmp, div, fromNumber, toNumber, ZERO, type Q } from './exact';
import { defaultRecordsOptions, type RecordsOptions } from './settings';
import type { BaselineSource, ProgressResult, RateRecord, ScriptLookup, Session, Trend } from './types';
import { validateRows, type ValidRow } from './validate';

export interface ProgressInput {
  /** The records file's text, as read (a byte-order mark is skipped; CRLF is fine). */
  text: string;
  /** Finds a script named in a row, by the path as written (relative to the records file). */
  scripts: ScriptLookup;
  options?: RecordsOptions;
  /** Today's date, YYYY-MM-DD: rows dated later are reported. */
  today: string;
  /** Word data, to count the syllables of transcripts (syllables per second). */
  data?: WordData;
}

interface Rate {
  words: Q;
  seconds: Q;
}
const rateOf = (r: Rate): Q => div(r.words, r.seconds);
const pool = (rows: ValidRow[]): Rate => rows.reduce((a, r) => ({ words: add(a.words, r.words), seconds: add(a.seconds, r.seconds) }), { words: ZERO, seconds: ZERO });

/** Whether a ratio meets the mark, compared as exact fractions. */
export function meetsMark(ratio: Q, mark: number): boolean {
  return cmp(ratio, fromNumber(mark)) >= 0;
}

/**
 * The unassisted rate a paced row of `client` on `day` is compared with: that day's unassisted
 * rows of the client pooled (total words / total seconds), else the latest earlier day's, else
 * the script's @baseline, else none.
 */
function baselineFor(unassisted: Map<string, ValidRow[]>, row: ValidRow): { source: BaselineSource; rate: Q | null } {
  const days = (unassisted.get(row.client) ?? []).filter((u) => u.day <= row.day);
  if (days.length) {
    const latest = Math.max(...days.map((u) => u.day));
    const same = days.filter((u) => u.day === latest);
    const p = pool(same);
    if (p.words.n > 0n) {
      const rate = rateOf(p);
      return {
        source: { from: latest === row.day ? 'same-day' : 'earlier-day', date: same[0].date, lines: same.map((u) => u.line), wps: toNumber(rate) },
        rate,
      };
    }
  }
  const b = row.facts?.baseline;
  if (b && b > 0) return { source: { from: 'script', wps: b }, rate: fromNumber(b) };
  return { source: { from: 'none' }, rate: null };
}

function slopePerWeek(points: [number, number][]): number | null {
  if (new Set(points.map((p) => p[0])).size < 2) return null;
  return linearRegression(points.map(([day, y]) => [day / 7, y])).m;
}

const pct = (x: number): string => `${formatNumber(x * 100, 0)}%`;

function readiness(sessions: Session[], o: RecordsOptions): { ready: boolean; note: string } {
  const rated = sessions.filter((s) => s.ratio !== null);
  const atMark = rated.filter((s) => s.benefit).length;
  const n = o.readySessions;
  const last = sessions.slice(-n);
  const tally = `at or above the mark (${formatNumber(o.benefitMark)}) in ${atMark} of ${sessions.length} session${sessions.length === 1 ? '' : 's'}`;
  if (sessions.length < n) return { ready: false, note: `${tally}; ${n} are needed before a readiness note` };
  if (!last.every((s) => s.benefit)) return { ready: false, note: tally };
  const floor = o.accuracyFloor;
  if (floor !== null && !last.every((s) => s.accuracy !== null && cmp(fromNumber(s.accuracy), fromNumber(floor)) >= 0)) {
    return { ready: false, note: `meets the mark in the last ${n} session${n === 1 ? '' : 's'}, but accuracy is below ${pct(floor)} or not recorded` };
  }
  return { ready: true, note: `meets the mark in the last ${n} session${n === 1 ? '' : 's'}${floor !== null ? ` with accuracy of ${pct(floor)} or more` : ''}; consider the next rung` };
}

/** What the records core reads from one file: the result, with its problems as typed findings. */
export type RecordsReading = Omit<ProgressResult, 'problems'> & { findings: Finding[] };

/**
 * Rates, ratios and trends of one records file, and what could not be used as findings (the
 * records rules word them: `readProgress` in rules/records.ts). Never throws on what the file holds.
 */
export function readRecords(input: ProgressInput): RecordsReading {
  const o = input.options ?? defaultRecordsOptions();
  const text = input.text.charCodeAt(0) === 0xfeff ? input.text.slice(1) : input.text;
  const csv = readCsv(text);
  const checked = validateRows({ header: csv.header, rows: csv.rows, scripts: input.scripts, options: o, today: input.today, data: input.data });
  const findings: Finding[] = [...csv.findings, ...checked.findings];

  const unassisted = new Map<string, ValidRow[]>();
  for (const r of checked.rows) if (r.condition === 'unassisted') unassisted.set(r.client, [...(unassisted.get(r.client) ?? []), r]);

  const records: RateRecord[] = [];
  const groups = new Map<string, { rows: ValidRow[]; first: ValidRow }>();
  for (const r of checked.rows) {
    const wps = toNumber(rateOf(r));
    const sps = r.syllables !== null ? r.syllables / toNumber(r.seconds) : null;
    let ratio: number | null = null;
    let benefit: boolean | null = null;
    let baseline: BaselineSource | null = null;
    let paceKept: number | null = null;
    if (r.condition === 'paced') {
      const b = baselineFor(unassisted, r);
      baseline = b.source;
      if (b.rate) {
        const q = div(rateOf(r), b.rate);
        ratio = toNumber(q);
        benefit = meetsMark(q, o.benefitMark);
      }
      if (r.pace) paceKept = r.pace.unit === 'wps' ? wps / r.pace.value : sps !== null ? sps / r.pace.value : null;
      if (r.script && r.rungIndex !== null) {
        const key = JSON.stringify([r.client, r.script, r.rungIndex]);
        const g = groups.get(key) ?? { rows: [], first: r };
        g.rows.push(r);
        groups.set(key, g);
      }
    }
    records.push({
      line: r.line,
      date: r.date,
      client: r.client,
      script: r.script,
      rung: r.rung,
      rungName: r.facts && r.rungIndex !== null ? r.facts.rungs[r.rungIndex].name : null,
      rungIndex: r.rungIndex,
      condition: r.condition,
      words: toNumber(r.words),
      wordsFromTranscript: r.wordsFromTranscript,
      fillersLeftOut: r.fillersLeftOut,
      seconds: toNumber(r.seconds),
      task: r.task,
      correct: r.correct,
      note: r.note,
      pace: r.pace,
      paceFrom: r.paceFrom,
      wps,
      sps,
      ratio,
      baseline,
      benefit,
      paceKept,
      accuracy: r.correct !== null && r.words.n > 0n ? r.correct / toNumber(r.words) : null,
    });
  }

  const trends: Trend[] = [];
  for (const { rows, first } of groups.values()) {
    const byDay = new Map<number, ValidRow[]>();
    for (const r of rows) byDay.set(r.day, [...(byDay.get(r.day) ?? []), r]);
    const ordered = [...byDay.entries()].sort((a, b) => a[0] - b[0]);
    const sessions: Session[] = ordered.map(([, day]) => {
        const p = pool(day);
        const b = baselineFor(unassisted, day[0]);
        const q = b.rate ? div(rateOf(p), b.rate) : null;
        const withCorrect = day.filter((r) => r.correct !== null);
        const cw = pool(withCorrect).words;
        return {
          date: day[0].date,
          lines: day.map((r) => r.line),
          words: toNumber(p.words),
          seconds: toNumber(p.seconds),
          wps: toNumber(rateOf(p)),
          ratio: q ? toNumber(q) : null,
          benefit: q ? meetsMark(q, o.benefitMark) : null,
          accuracy: withCorrect.length && cw.n > 0n ? withCorrect.reduce((n, r) => n + r.correct!, 0) / toNumber(cw) : null,
        };
      });
    const points = (get: (s: Session) => number | null): [number, number][] =>
      sessions.flatMap((s, i) => (get(s) === null ? [] : [[ordered[i][0], get(s)!] as [number, number]]));
    const ratioPoints = points((s) => s.ratio);
    const accuracyPoints = points((s) => s.accuracy);
    const { ready, note } = readiness(sessions, o);
    trends.push({
      client: first.client,
      script: first.script!,
      rung: first.facts!.rungs[first.rungIndex!].name,
      rungIndex: first.rungIndex!,
      sessions,
      ratios: ratioPoints.map((p) => p[1]),
      slopePerWeek: slopePerWeek(ratioPoints),
      accuracySlopePerWeek: slopePerWeek(accuracyPoints),
      atMark: sessions.filter((s) => s.benefit).length,
      ready,
      note,
      line: Math.max(...sessions[sessions.length - 1].lines),
    });
  }
  trends.sort((a, b) => a.client.localeCompare(b.client) || a.script.localeCompare(b.script) || a.rungIndex - b.rungIndex);
  findings.sort((a, b) => a.line - b.line || a.character - b.character);
  return { records, trends, findings, delimiter: csv.delimiter, rows: csv.rows.length };
}
