// The custom pieces of the Rungs protocol the extension uses. Types and method names come from the
// one contract both sides share (server/src/lsp/contract.ts, type-only: no server code is bundled).
import { NotificationType, RequestType } from 'vscode-languageclient/node';
import {
  DID_ANALYZE_METHOD,
  ITEM_AT_METHOD,
  LADDER_METHOD,
  PROGRESS_METHOD,
  REPORT_METHOD,
  SORT_RUNG_COMMAND,
  type ItemAt,
  type ProgressView,
  type Ladder,
  type ScriptReport,
} from '../../server/src/lsp/contract';

export type { ItemAt, Ladder, ProgressView, LadderItem, LadderProblem, LadderRung, LadderStep, ScriptReport } from '../../server/src/lsp/contract';

export const LadderRequest = new RequestType<{ uri: string }, Ladder | null, void>(LADDER_METHOD);
export const ReportRequest = new RequestType<{ uri: string }, ScriptReport | null, void>(REPORT_METHOD);
export const ItemAtRequest = new RequestType<{ uri: string; line: number }, ItemAt | null, void>(ITEM_AT_METHOD);
export const ProgressRequest = new RequestType<{ uri: string }, ProgressView | null, void>(PROGRESS_METHOD);
export const DidAnalyzeNotification = new NotificationType<{ uri: string; version: number | null }>(DID_ANALYZE_METHOD);

/** The server's command that sorts one rung (arguments: document uri, rung header line). */
export const SERVER_SORT_RUNG = SORT_RUNG_COMMAND;
