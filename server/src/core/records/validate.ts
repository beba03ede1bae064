// Checks records rows one cell at a time. A bad cell is a typed finding on that cell (line and
// column; the records rules in server/src/rules/ word it); a row with one is left out of the
// computations but never dropped unreported.
import { parsePaces } from '../pace';
import { Pronouncer } from '../pronounce';
import { tokenize } from '../tokenize';
import { finding, type EmptyCellReason, type Finding, type RecordCellProblem } from '../findings';
import type { Pace, WordData } from '../types';
import { DEFAULT_WCM_OPTIONS } from '../wcm';
import { COLUMNS, MAX_PLAUSIBLE_WPS, REQUIRED_COLUMNS, type Column } from './columns';
import type { CsvRow } from './csv';
import { decimal, isInteger, toNumber, type Q } from './exact';
import { findRung } from './scripts';
import type { RecordsOptions } from './settings';
import type { Cell, Condition, ScriptFacts, ScriptLookup } from './types';

/** A row that passed every check, with exact quantities for the benefit comparison. */
export interface ValidRow {
  line: number;
  cells: Partial<Record<Column, Cell>>;
  date: string;
  day: number;
  client: string;
  condition: Condition;
  script: string | null;
  facts: ScriptFacts | null;
  rung: string | null;
  rungIndex: number | null;
  words: Q;
  seconds: Q;
  wordsFromTranscript: boolean;
  fillersLeftOut: string[];
  syllables: number | null;
  correct: number | null;
  pace: Pace | null;
  paceFrom: 'row' | 'rung' | null;
  task: string | null;
  note: string | null;
}

export interface ValidateInput {
  header: CsvRow | null;
  rows: CsvRow[];
  scripts: ScriptLookup;
  options: RecordsOptions;
  /** Today's date (YYYY-MM-DD): later dates are reported as in the future. */
  today: string;
  /** Word data, to count syllables of transcripts; without it only words are counted. */
  data?: WordData;
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** Days since 1970-01-01 of a YYYY-MM-DD date, or null when the date does not exist. */
export function dayNumber(date: string): number | null {
  const m = ISO_DATE.exec(date);
  if (!m) return null;
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const t = Date.UTC(y, mo - 1, d);
  const back = new Date(t);
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d) return null;
  return t / 86_400_000;
}


export function validateRows(input: ValidateInput): { rows: ValidRow[]; findings: Finding[] } {
  const findings: Finding[] = [];
  const { header } = input;
  if (!header) return { rows: [], findings };
  const index = new Map<Column, number>();
  header.cells.forEach((c, k) => {
    const name = c.value.trim().toLowerCase() as Column;
    if (!COLUMNS.includes(name)) {
      findings.push(finding(c, { kind: 'record-unknown-column', name: c.value.trim(), known: COLUMNS }));
    } else if (index.has(name)) {
      findings.push(finding(c, { kind: 'record-repeated-column', name }));
    } else index.set(name, k);
  });
  const headerRange = { line: header.line, character: 0, endLine: header.line, endCharacter: header.cells[header.cells.length - 1]?.endCharacter ?? 0 };
  for (const col of REQUIRED_COLUMNS) {
    if (!index.has(col)) findings.push(finding(headerRange, { kind: 'record-missing-column', column: col }));
  }
  const pronouncer = input.data ? new Pronouncer(input.data, [], DEFAULT_WCM_OPTIONS) : null;
  const fillers = new Set(input.options.fillers.map((f) => f.toLowerCase()));
  const today = dayNumber(input.today);
  const seen = new Map<string, number>();
  const rows: ValidRow[] = [];

  for (const row of input.rows) {
    const cells: Partial<Record<Column, Cell>> = {};
    for (const [col, k] of index) {
      // A short row's missing cells sit, empty, at the end of its last cell.
      const last = row.cells[row.cells.length - 1];
      cells[col] = row.cells[k] ?? { value: '', line: last.endLine, character: last.endCharacter, endLine: last.endLine, endCharacter: last.endCharacter };
    }
    const own: Finding[] = [];
    const bad = (col: Column, problem: RecordCellProblem) => own.push(finding(cells[col]!, { kind: 'record-bad-cell', column: col, value: cells[col]!.value.trim(), problem }));
    const text = (col: Column) => (cells[col]?.value ?? '').trim();
    const missing = (col: Column, why: EmptyCellReason | null = null) => index.has(col) && bad(col, { what: 'empty', why });

    const date = text('date');
    let day: number | null = null;
    if (!date) missing('date');
    else if (!ISO_DATE.test(date)) bad('date', { what: 'not-iso-date' });
    else if ((day = dayNumber(date)) === null) bad('date', { what: 'not-in-calendar' });
    else if (today !== null && day > today) bad('date', { what: 'in-future', today: input.today });

    const client = text('client');
    if (!client) missing('client');

    const condText = text('condition').toLowerCase();
    let condition: Condition | null = null;
    if (!condText) missing('condition', 'condition-choices');
    else if (condText === 'unassisted' || condText === 'paced') condition = condText;
    else bad('condition', { what: 'unknown-condition' });

    const seconds = decimal(text('seconds'));
    if (!text('seconds')) missing('seconds');
    else if (!seconds) bad('seconds', { what: 'not-a-number' });
    else if (seconds.n <= 0n) bad('seconds', { what: 'not-above-zero' });

    let words: Q | null = null;
    let wordsFromTranscript = false;
    const fillersLeftOut: string[] = [];
    let spoken: string[] | null = null;
    const transcript = text('transcript');
    if (transcript) {
      spoken = tokenize(transcript).flatMap((t) => t.words);
      for (const w of spoken) if (fillers.has(w)) fillersLeftOut.push(w);
      spoken = spoken.filter((w) => !fillers.has(w));
    }
    if (text('words')) {
      const w = decimal(text('words'));
      if (!w) bad('words', { what: 'not-a-number' });
      else if (w.n < 0n || !isInteger(w)) bad('words', { what: 'not-a-count' });
      else words = w;
    } else if (spoken) {
      words = { n: BigInt(spoken.length), d: 1n };
      wordsFromTranscript = true;
    } else missing('words', 'no-transcript');
    if (words && seconds && seconds.n > 0n && toNumber(words) / toNumber(seconds) > MAX_PLAUSIBLE_WPS) {
      const rate = toNumber(words) / toNumber(seconds);
      bad(wordsFromTranscript ? 'transcript' : 'words', { what: 'implausible-rate', words: toNumber(words), seconds: text('seconds'), rate, limit: MAX_PLAUSIBLE_WPS });
    }

    let correct: number | null = null;
    if (text('correct')) {
      const c = decimal(text('correct'));
      if (!c || c.n < 0n || !isInteger(c)) bad('correct', { what: 'not-a-count' });
      else if (words && cmpGreater(c, words)) bad('correct', { what: 'more-correct-than-words', words: toNumber(words) });
      else correct = toNumber(c);
    }

    const scriptPath = text('script') || null;
    let facts: ScriptFacts | null = null;
    if (scriptPath) {
      facts = input.scripts(scriptPath);
      if (!facts) bad('script', { what: 'no-such-script' });
    } else if (condition === 'paced') missing('script', 'paced-needs-script');
    const rungText = text('rung') || null;
    let rungIndex: number | null = null;
    if (rungText && facts) {
      rungIndex = findRung(facts, rungText);
      if (rungIndex === null) {
        bad('rung', { what: 'no-such-rung', script: scriptPath!, rungs: facts.rungs.map((r) => r.name) });
      }
    } else if (!rungText && condition === 'paced') missing('rung', 'paced-needs-rung');

    let pace: Pace | null = null;
    let paceFrom: 'row' | 'rung' | null = null;
    if (condition === 'paced') {
      if (text('pace')) {
        const { paces, error } = parsePaces(text('pace'));
        if (error || paces.length !== 1) bad('pace', error ? { what: 'unreadable-pace', explanation: error } : { what: 'not-one-pace', count: paces.length });
        else [pace, paceFrom] = [paces[0], 'row'];
      } else if (facts && rungIndex !== null) {
        const first = facts.rungs[rungIndex].paces[0];
        if (first) [pace, paceFrom] = [first, 'rung'];
        else bad('rung', { what: 'rung-without-pace' });
      } else if (!scriptPath) {
        // With an unknown script or rung the pace is unknown too, but that is already reported.
        bad('pace', { what: 'no-pace' });
      }
    }

    const key = JSON.stringify(row.cells.map((c) => c.value.trim()));
    const earlier = seen.get(key);
    if (earlier !== undefined) {
      own.push(finding({ line: row.line, character: 0, endLine: row.line, endCharacter: row.cells[row.cells.length - 1].endCharacter }, { kind: 'record-duplicate-row', earlierLine: earlier }));
    } else seen.set(key, row.line);

    if (own.length || day === null || !condition || !client || !words || !seconds) {
      findings.push(...own);
      continue;
    }
    rows.push({
      line: row.line,
      cells,
      date,
      day,
      client,
      condition,
      script: scriptPath,
      facts,
      rung: rungText,
      rungIndex,
      words,
      seconds,
      wordsFromTranscript,
      fillersLeftOut,
      syllables: spoken && pronouncer ? spoken.reduce((n, w) => n + pronouncer.score(w).syllables, 0) : null,
      correct,
      pace,
      paceFrom,
      task: text('task') || null,
      note: text('note') || null,
    });
  }
  return { rows, findings };
}

const cmpGreater = (a: Q, b: Q): boolean => a.n * b.d > b.n * a.d;

