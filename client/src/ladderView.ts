// The ladder view: a webview beside the editor that draws the current script's difficulty ladder,
// redraws when the server has analysed a new version, and moves the editor to an item on click.
// One panel follows the active Rungs editor, the way a preview follows its source.
import { randomBytes } from 'node:crypto';
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';
import { renderLadderBody, renderLadderPage } from './ladderHtml';
import { LadderRequest } from './protocol';

export const LADDER_VIEW_TYPE = 'rungs.ladder';

export class LadderView implements vscode.Disposable {
  private panel: vscode.WebviewPanel | undefined;
  private uri: vscode.Uri | undefined;
  private generation = 0;
  private readonly disposables: vscode.Disposable[] = [];

  constructor(private readonly getClient: () => LanguageClient | undefined) {
    this.disposables.push(
      vscode.window.onDidChangeActiveTextEditor((e) => {
        if (this.panel && e && e.document.languageId === 'rungs' && e.document.uri.toString() !== this.uri?.toString()) {
          this.uri = e.document.uri;
          void this.refresh();
        }
      }),
    );
  }

  /** Shows the view for a document, creating the panel beside the editor if needed. */
  async show(document: vscode.TextDocument): Promise<void> {
    this.uri = document.uri;
    if (!this.panel) {
      this.panel = vscode.window.createWebviewPanel(
        LADDER_VIEW_TYPE,
        'Ladder',
        { viewColumn: vscode.ViewColumn.Beside, preserveFocus: true },
        { enableScripts: true, localResourceRoots: [], retainContextWhenHidden: false },
      );
      this.panel.onDidDispose(() => {
        this.panel = undefined;
      });
      this.panel.webview.onDidReceiveMessage((m: unknown) => this.onMessage(m));
      this.panel.onDidChangeViewState((e) => {
        if (e.webviewPanel.visible) void this.refresh(true);
      });
      await this.refresh(true);
    } else {
      this.panel.reveal(vscode.ViewColumn.Beside, true);
      await this.refresh();
    }
  }

  /** Called for every `rungs/didAnalyze`: redraw if it is the document on show. */
  onDidAnalyze(uri: string): void {
    if (this.panel && this.uri?.toString() === uri) void this.refresh();
  }

  private heading(): string {
    const name = this.uri ? this.uri.path.split('/').pop() ?? '' : '';
    return `Ladder: ${name}`;
  }

  /** Asks the server for the ladder and draws it; `full` rebuilds the page instead of patching it. */
  private async refresh(full = false): Promise<void> {
    const panel = this.panel;
    const client = this.getClient();
    if (!panel || !this.uri) return;
    const gen = ++this.generation;
    let body: string;
    try {
      const ladder = client?.isRunning()
        ? await client.sendRequest(LadderRequest, { uri: client.code2ProtocolConverter.asUri(this.uri) })
        : null;
      body = client?.isRunning() ? renderLadderBody(ladder) : '<p class="empty">The Rungs language server is not running.</p>';
    } catch (e) {
      body = `<p class="empty">The ladder could not be drawn: ${String(e instanceof Error ? e.message : e).replace(/[&<>"']/g, '')}</p>`;
    }
    // A newer refresh may have finished first; only the latest draws.
    if (gen !== this.generation || panel !== this.panel) return;
    panel.title = this.heading();
    if (full) {
      panel.webview.html = renderLadderPage({
        cspSource: panel.webview.cspSource,
        nonce: randomBytes(16).toString('base64'),
        heading: this.heading(),
        body,
      });
    } else {
      void panel.webview.postMessage({ type: 'update', body, heading: this.heading(), version: gen });
    }
  }

  private async onMessage(m: unknown): Promise<void> {
    const msg = m as { type?: string; line?: unknown };
    if (msg?.type !== 'reveal' || typeof msg.line !== 'number' || !this.uri) return;
    const line = Math.max(0, Math.floor(msg.line));
    const uri = this.uri;
    const visible = vscode.window.visibleTextEditors.find((e) => e.document.uri.toString() === uri.toString());
    const document = visible?.document ?? (await vscode.workspace.openTextDocument(uri));
    const editor = await vscode.window.showTextDocument(document, {
      viewColumn: visible?.viewColumn ?? vscode.ViewColumn.One,
      preserveFocus: false,
    });
    const at = new vscode.Position(Math.min(line, document.lineCount - 1), 0);
    editor.selection = new vscode.Selection(at, at);
    editor.revealRange(new vscode.Range(at, at), vscode.TextEditorRevealType.InCenterIfOutsideViewport);
  }

  get visibleUri(): vscode.Uri | undefined {
    return this.panel ? this.uri : undefined;
  }

  dispose(): void {
    this.panel?.dispose();
    for (const d of this.disposables) d.dispose();
  }
}
