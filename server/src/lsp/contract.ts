// The custom parts of the Rungs protocol, shared by the server (server/src/lsp) and the VS Code
// client (client/src): payload types and method names only, no runtime code, so each side builds
// its own RequestType from its own library. Lines are 0-based, as everywhere in LSP.

export interface LadderItem {
  line: number;
  text: string;
  /** Composite difficulty, 0-100. */
  difficulty: number;
  /** The item's value on the ladder metric (`Ladder.metric`; equals `difficulty` by default). */
  value?: number;
  /** 1-based rank of the item's difficulty within its rung. */
  rank: number;
  /** Words of the item whose pronunciation is estimated (no dictionary entry or override). */
  estimatedWords?: number;
  /** The item's set labels in force (`@set`), for the set marks. */
  sets?: string[];
}

export interface LadderRung {
  name: string;
  /** 0-based line of the header (of the first item for the implicit rung). */
  line: number;
  /** Median, lowest and highest item value on the ladder metric (`Ladder.metric`). */
  median: number;
  min: number;
  max: number;
  paces: string[];
  items: LadderItem[];
}

export interface LadderStep {
  /** Rung indices into `rungs`: the lower rung of the step, and the next one. */
  from: number;
  to: number;
  /** Median of `to` minus median of `from`, on the ladder metric. */
  delta: number;
  /** Id of the ladder rule that reports this step, or null when the step is fine. */
  problem: string | null;
}

export interface LadderProblem {
  rule: string;
  severity: 'error' | 'warning' | 'info' | 'hint';
  line: number;
  message: string;
}

export interface Ladder {
  title: string | null;
  direction: 'rising' | 'falling';
  /** The metric the ladder rules judge (config `ladder.metric`), as messages name it: "difficulty", "syllables". */
  metric?: string;
  /** Top of the value scale: 100 for difficulty, else the largest item value rounded up. */
  scaleMax?: number;
  /** Largest allowed step on that metric (the one step-too-big uses), or null when none applies. */
  maxStep: number | null;
  rungs: LadderRung[];
  steps: LadderStep[];
  problems: LadderProblem[];
}

export interface ItemAt {
  line: number;
  difficulty: number;
  rank: number;
  rungName: string;
  /** The rung's first pace as written, e.g. "1 wps". */
  pace: string;
  /** Projected duration at that pace, in seconds. */
  seconds: number;
  /** Words of the item whose pronunciation is estimated (no dictionary entry or override). */
  estimatedWords?: number;
}

/**
 * The mark both sides put before a number that rests on estimated pronunciations ("D ≈42"),
 * with the words "estimated pronunciation" in the tooltip or hover that explains it.
 */
export const ESTIMATED_MARK = '≈';

export const LADDER_METHOD = 'rungs/ladder';
export const ITEM_AT_METHOD = 'rungs/itemAt';
export const DID_ANALYZE_METHOD = 'rungs/didAnalyze';
/** The server's command that sorts one rung (arguments: document uri, rung header line). */
export const SORT_RUNG_COMMAND = 'rungs.sortRung';

/** One session of a client's paced practice on a rung, as the progress view draws it. */
export interface ProgressPoint {
  date: string;
  /** Days since the first session of the same trend. */
  day: number;
  ratio: number | null;
  benefit: boolean | null;
  /** 0-based line of the session's last row in the records file. */
  line: number;
}

/** The progress view's payload for one records file (`rungs/progress`). */
export interface ProgressView {
  benefitMark: number;
  rows: number;
  recordsRead: number;
  problems: number;
  trends: {
    client: string;
    script: string;
    rung: string;
    note: string;
    ready: boolean;
    slopePerWeek: number | null;
    points: ProgressPoint[];
  }[];
}

export const PROGRESS_METHOD = 'rungs/progress';

/**
 * The server's paced-delivery commands (arguments: document uri, rung header line). Each writes
 * its files beside the script and answers a DeliveryResult.
 */
export const EXPORT_CUES_COMMAND = 'rungs.server.exportCues';
export const MAKE_AUDIO_COMMAND = 'rungs.server.makeAudio';
export const PRACTICE_PAGE_COMMAND = 'rungs.server.practicePage';

export interface DeliveryResult {
  ok: boolean;
  /** The file or folder written (absolute path), when ok. */
  path?: string;
  /** One line for people: what was written, or why nothing was. */
  message: string;
}
/** `rungs/report`: the plain data of a script's report (server/src/report/model.ts), drawn by the client. */
export const REPORT_METHOD = 'rungs/report';
export type { ScriptReport } from '../report/model';
