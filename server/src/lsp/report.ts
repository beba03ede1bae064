// `rungs/report`: the data of the printable report for one open script. The editor draws it with
// the same pure renderer as `rungs report`, so the webview and the saved file match the CLI's.
import { RequestType } from 'vscode-languageserver/node';
import { REPORT_METHOD, type ScriptReport } from './contract';
import { buildScriptReport } from '../report/model';
import type { Snapshot } from './documents';

export const ReportRequest = new RequestType<{ uri: string }, ScriptReport | null, void>(REPORT_METHOD);

/** The report data; the file is named by the last part of its URI, as the editor tab shows it. */
export function scriptReport(s: Snapshot): ScriptReport {
  const name = decodeURIComponent(s.uri.split(/[/\\]/).pop() ?? s.uri);
  return buildScriptReport(name, s.analysis, s.problems);
}
