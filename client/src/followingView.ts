// A webview beside the editor that follows the active document of one language, the way a preview
// follows its source: it asks the server for its data, redraws when the server has analysed a new
// version, and moves the editor to a line on click. The ladder and progress views are both one.
import { randomBytes } from 'node:crypto';
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';
import type { PageOptions } from './ladderHtml';
import { revealLine } from './reveal';

export interface FollowingViewSpec {
  viewType: string;
  /** Panel title before the file name ("Ladder" -> "Ladder: a.rungs"). */
  title: string;
  /** The language id of the documents the view follows. */
  language: string;
  /** Asks the running server for the document's data and renders the page body. */
  body(client: LanguageClient, uri: vscode.Uri): Promise<string>;
  page(o: PageOptions): string;
}

export class FollowingView implements vscode.Disposable {
  private panel: vscode.WebviewPanel | undefined;
  private uri: vscode.Uri | undefined;
  private generation = 0;
  private readonly disposables: vscode.Disposable[] = [];

  constructor(
    private readonly getClient: () => LanguageClient | undefined,
    private readonly spec: FollowingViewSpec,
  ) {
    this.disposables.push(
      vscode.window.onDidChangeActiveTextEditor((e) => {
        if (this.panel && e && e.document.languageId === spec.language && e.document.uri.toString() !== this.uri?.toString()) {
          this.uri = e.document.uri;
          void this.refresh();
        }
      }),
    );
  }

  /** Shows the view for a document, creating the panel beside the editor if needed. */
  async show(document: vscode.TextDocument): Promise<void> {
    this.uri = document.uri;
    if (this.panel) {
      this.panel.reveal(vscode.ViewColumn.Beside, true);
      await this.refresh();
      return;
    }
    this.panel = vscode.window.createWebviewPanel(
      this.spec.viewType,
      this.spec.title,
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
  }

  /** Called for every `rungs/didAnalyze`: redraw if it is the document on show. */
  onDidAnalyze(uri: string): void {
    if (this.panel && this.uri?.toString() === uri) void this.refresh();
  }

  private heading(): string {
    const name = this.uri ? this.uri.path.split('/').pop() ?? '' : '';
    return `${this.spec.title}: ${name}`;
  }

  /** Asks the server for the data and draws it; `full` rebuilds the page instead of patching it. */
  private async refresh(full = false): Promise<void> {
    const panel = this.panel;
    const client = this.getClient();
    if (!panel || !this.uri) return;
    const gen = ++this.generation;
    let body: string;
    try {
      body = client?.isRunning() ? await this.spec.body(client, this.uri) : '<p class="empty">The Rungs language server is not running.</p>';
    } catch (e) {
      body = `<p class="empty">The view could not be drawn: ${String(e instanceof Error ? e.message : e).replace(/[&<>"']/g, '')}</p>`;
    }
    // A newer refresh may have finished first; only the latest draws.
    if (gen !== this.generation || panel !== this.panel) return;
    panel.title = this.heading();
    if (full) {
      panel.webview.html = this.spec.page({ cspSource: panel.webview.cspSource, nonce: randomBytes(16).toString('base64'), heading: this.heading(), body });
    } else {
      void panel.webview.postMessage({ type: 'update', body, heading: this.heading(), version: gen });
    }
  }

  private async onMessage(m: unknown): Promise<void> {
    const msg = m as { type?: string; line?: unknown };
    if (msg?.type !== 'reveal' || typeof msg.line !== 'number' || !this.uri) return;
    await revealLine(this.uri, msg.line);
  }

  get visibleUri(): vscode.Uri | undefined {
    return this.panel ? this.uri : undefined;
  }

  dispose(): void {
    this.panel?.dispose();
    for (const d of this.disposables) d.dispose();
  }
}
