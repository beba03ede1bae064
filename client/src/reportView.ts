// "Open Report for This Script": the printable report of the active script in a webview, drawn by
// the same renderer as `rungs report` from the server's `rungs/report` data, with a Save button
// that writes the self-contained HTML file (no script, its own strict policy) where the user picks.
import { randomBytes } from 'node:crypto';
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';
import { CAUTION } from '../../server/src/core/caution';
import { renderReport, type ReportInput } from '../../server/src/report/page';
import { ReportRequest } from './protocol';

export const REPORT_VIEW_TYPE = 'rungs.report';

/** Opens one panel per call: a report is a snapshot of the script as it was. */
export async function openReport(client: LanguageClient, document: vscode.TextDocument, version: string): Promise<vscode.WebviewPanel | undefined> {
  const data = await client.sendRequest(ReportRequest, { uri: client.code2ProtocolConverter.asUri(document.uri) });
  if (!data) {
    void vscode.window.showInformationMessage('Rungs: the report is not ready yet; try again once the script has been checked.');
    return undefined;
  }
  const input: ReportInput = { scripts: [data], version, caution: CAUTION };
  const name = document.uri.path.split('/').pop() ?? 'script';
  const panel = vscode.window.createWebviewPanel(
    REPORT_VIEW_TYPE,
    `Report: ${name}`,
    { viewColumn: vscode.ViewColumn.Beside, preserveFocus: false },
    { enableScripts: true, localResourceRoots: [] },
  );
  panel.webview.html = renderReport(input, { cspSource: panel.webview.cspSource, nonce: randomBytes(16).toString('base64') });
  panel.webview.onDidReceiveMessage(async (m: unknown) => {
    if ((m as { type?: string })?.type !== 'save') return;
    const base = document.uri.scheme === 'file' ? vscode.Uri.joinPath(document.uri, '..') : undefined;
    const target = await vscode.window.showSaveDialog({
      defaultUri: base ? vscode.Uri.joinPath(base, name.replace(/\.rungs$/, '') + '-report.html') : undefined,
      filters: { 'HTML report': ['html'] },
      saveLabel: 'Save report',
    });
    if (!target) return;
    await vscode.workspace.fs.writeFile(target, new TextEncoder().encode(renderReport(input)));
    void vscode.window.setStatusBarMessage(`Rungs: report saved to ${target.fsPath}`, 5000);
  });
  return panel;
}
