// The progress view: a webview beside a rate records file that draws each client's ratio per
// session against the benefit mark, redraws when the server has re-read the file (live on edit),
// and moves the editor to a row on click. One panel follows the active records editor.
import { randomBytes } from 'node:crypto';
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';
import { renderProgressBody, renderProgressPage } from './progressHtml';
import { ProgressRequest } from './protocol';

export const PROGRESS_VIEW_TYPE = 'rungs.progress';
export const RECORDS_LANGUAGE = 'rungs-records';

export class ProgressView implements vscode.Disposable {
  private panel: vscode.WebviewPanel | undefined;
  private uri: vscode.Uri | undefined;
  private generation = 0;
  private readonly disposables: vscode.Disposable[] = [];

  constructor(private readonly getClient: () => LanguageClient | undefined) {
    this.disposables.push(
      vscode.window.onDidChangeActiveTextEditor((e) => {
        if (this.panel && e && e.document.languageId === RECORDS_LANGUAGE && e.document.uri.toString() !== this.uri?.toString()) {
          this.uri = e.document.uri;
          void this.refresh();
        }
      }),
    );
  }

  async show(document: vscode.TextDocument): Promise<void> {
    this.uri = document.uri;
    if (this.panel) {
      this.panel.reveal(vscode.ViewColumn.Beside, true);
      await this.refresh();
      return;
    }
    this.panel = vscode.window.createWebviewPanel(PROGRESS_VIEW_TYPE, 'Progress', { viewColumn: vscode.ViewColumn.Beside, preserveFocus: true }, {
      enableScripts: true,
      localResourceRoots: [],
    });
    this.panel.onDidDispose(() => (this.panel = undefined));
    this.panel.webview.onDidReceiveMessage((m: unknown) => this.onMessage(m));
    this.panel.onDidChangeViewState((e) => {
      if (e.webviewPanel.visible) void this.refresh(true);
    });
    await this.refresh(true);
  }

  /** Called for every `rungs/didAnalyze`: redraw if it is the records file on show. */
  onDidAnalyze(uri: string): void {
    if (this.panel && this.uri?.toString() === uri) void this.refresh();
  }

  private heading(): string {
    return `Progress: ${this.uri?.path.split('/').pop() ?? ''}`;
  }

  private async refresh(full = false): Promise<void> {
    const panel = this.panel;
    const client = this.getClient();
    if (!panel || !this.uri) return;
    const gen = ++this.generation;
    let body: string;
    try {
      const view = client?.isRunning() ? await client.sendRequest(ProgressRequest, { uri: client.code2ProtocolConverter.asUri(this.uri) }) : null;
      body = client?.isRunning() ? renderProgressBody(view) : '<p class="empty">The Rungs language server is not running.</p>';
    } catch (e) {
      body = `<p class="empty">The progress could not be drawn: ${String(e instanceof Error ? e.message : e).replace(/[&<>"']/g, '')}</p>`;
    }
    if (gen !== this.generation || panel !== this.panel) return;
    panel.title = this.heading();
    if (full) {
      panel.webview.html = renderProgressPage({ cspSource: panel.webview.cspSource, nonce: randomBytes(16).toString('base64'), heading: this.heading(), body });
    } else {
      void panel.webview.postMessage({ type: 'update', body, heading: this.heading(), version: gen });
    }
  }

  private async onMessage(m: unknown): Promise<void> {
    const msg = m as { type?: string; line?: unknown };
    if (msg?.type !== 'reveal' || typeof msg.line !== 'number' || !this.uri) return;
    const uri = this.uri;
    const visible = vscode.window.visibleTextEditors.find((e) => e.document.uri.toString() === uri.toString());
    const document = visible?.document ?? (await vscode.workspace.openTextDocument(uri));
    const editor = await vscode.window.showTextDocument(document, { viewColumn: visible?.viewColumn ?? vscode.ViewColumn.One, preserveFocus: false });
    const at = new vscode.Position(Math.min(Math.max(0, Math.floor(msg.line)), document.lineCount - 1), 0);
    editor.selection = new vscode.Selection(at, at);
    editor.revealRange(new vscode.Range(at, at), vscode.TextEditorRevealType.InCenterIfOutsideViewport);
  }

  dispose(): void {
    this.panel?.dispose();
    for (const d of this.disposables) d.dispose();
  }
}
