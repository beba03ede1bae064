// The custom pieces of the Rungs language server protocol that the extension uses. The server
// (server/src/lsp) defines them; these types mirror its payloads in the client's own terms so the
// client bundle carries no server code. Lines are 0-based, as everywhere in LSP.
import { NotificationType, RequestType } from 'vscode-languageclient/node';

export interface LadderItem {
  line: number;
  text: string;
  /** Composite difficulty, 0-100. */
  difficulty: number;
  /** 1-based rank of the item's difficulty within its rung. */
  rank: number;
}

export interface LadderRung {
  name: string;
  line: number;
  median: number;
  min: number;
  max: number;
  paces: string[];
  items: LadderItem[];
}

export interface LadderStep {
  /** Index into `rungs` of the lower rung of the step, and of the next one. */
  from: number;
  to: number;
  /** Change of median difficulty from `from` to `to`, in points. */
  delta: number;
  /** The id of the rule the step breaks, or null when the step is fine. */
  problem: string | null;
}

export interface LadderProblem {
  rule: string;
  severity: string;
  line: number;
  message: string;
}

export interface Ladder {
  title: string | null;
  direction: 'rising' | 'falling';
  maxStep: number;
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
}

export const LadderRequest = new RequestType<{ uri: string }, Ladder | null, void>('rungs/ladder');
export const ItemAtRequest = new RequestType<{ uri: string; line: number }, ItemAt | null, void>('rungs/itemAt');
export const DidAnalyzeNotification = new NotificationType<{ uri: string; version: number | null }>('rungs/didAnalyze');

/** The server's command that sorts one rung (arguments: document uri, rung header line). */
export const SERVER_SORT_RUNG = 'rungs.sortRung';
