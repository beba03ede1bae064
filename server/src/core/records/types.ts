// Plain data of client rate records: one row per measurement, read from a CSV file a clinician
// keeps in a spreadsheet. Positions are 0-based like the rest of the core (the text after any
// byte-order mark); the edges convert them.
import type { Pace, Problem, Range } from '../types';

/** One cell as written, with where it stands in the file. */
export interface Cell extends Range {
  value: string;
}

export type Condition = 'unassisted' | 'paced';

/** The facts of a stimulus script a records row can name: its rungs, their paces, its @baseline. */
export interface ScriptFacts {
  rungs: { name: string; line: number; paces: Pace[] }[];
  /** The script's `@baseline` (unassisted words per second), or null. */
  baseline: number | null;
}

/**
 * Finds a script named in a `script` cell (as written: a path relative to the records file).
 * Returns null when there is no such script. Injected by the edges: the CLI reads files, the
 * language server prefers open documents; the core never touches a file system.
 */
export type ScriptLookup = (path: string) => ScriptFacts | null;

/** Where a paced row's unassisted rate came from. */
export type BaselineSource =
  | { from: 'same-day' | 'earlier-day'; date: string; lines: number[]; wps: number }
  | { from: 'script'; wps: number }
  | { from: 'none' };

/** A row that passed validation, with what was computed from it. */
export interface RateRecord {
  /** 0-based line of the row. */
  line: number;
  date: string;
  client: string;
  script: string | null;
  /** The rung as written in the row (name or number), and the rung it resolved to. */
  rung: string | null;
  rungName: string | null;
  rungIndex: number | null;
  condition: Condition;
  words: number;
  /** True when `words` was counted from the transcript. */
  wordsFromTranscript: boolean;
  /** Fillers left out of a transcript count, in order of appearance. */
  fillersLeftOut: string[];
  seconds: number;
  task: string | null;
  correct: number | null;
  note: string | null;
  /** The model's pace for a paced row (the row's own, else the rung's first), or null. */
  pace: Pace | null;
  paceFrom: 'row' | 'rung' | null;
  wps: number;
  /** Syllables per second, when a transcript was given and syllables could be counted. */
  sps: number | null;
  /** Paced rows: paced rate / unassisted rate, or null when there is no unassisted rate. */
  ratio: number | null;
  baseline: BaselineSource | null;
  /** Paced rows with a ratio: whether it meets the benefit mark (exact comparison). */
  benefit: boolean | null;
  /** Achieved rate / the model's pace (same unit), or null when they cannot be compared. */
  paceKept: number | null;
  /** Correct words / words, when `correct` is given. */
  accuracy: number | null;
}

/** One session (a date) of paced practice of one client on one rung. */
export interface Session {
  date: string;
  lines: number[];
  words: number;
  seconds: number;
  wps: number;
  ratio: number | null;
  benefit: boolean | null;
  accuracy: number | null;
}

export interface Trend {
  client: string;
  script: string;
  rung: string;
  rungIndex: number;
  sessions: Session[];
  /** Ratios of the sessions that have one, in date order. */
  ratios: number[];
  /** Least-squares slope of ratio against time, per week; null with fewer than two dated ratios. */
  slopePerWeek: number | null;
  accuracySlopePerWeek: number | null;
  /** Sessions whose ratio meets the mark. */
  atMark: number;
  ready: boolean;
  /** A plain sentence for people ("meets the mark in the last 2 sessions; consider the next rung"). */
  note: string;
  /** 0-based line of the latest session's last row (where an editor shows the trend). */
  line: number;
}

/** What one records file holds and what follows from it. */
export interface ProgressResult {
  records: RateRecord[];
  trends: Trend[];
  problems: Problem[];
  /** The delimiter the file was read with. */
  delimiter: ',' | ';' | '\t';
  /** Rows read (not counting the header or blank lines), used or not. */
  rows: number;
}
