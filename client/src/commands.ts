// The commands that need more than one line: sorting the rung under the cursor, and scoring every
// script of the workspace into the Problems panel.
import * as vscode from 'vscode';
import { ExecuteCommandRequest, type LanguageClient } from 'vscode-languageclient/node';
import { rungLineAt } from './present';
import { LadderRequest, SERVER_SORT_RUNG } from './protocol';

export async function sortCurrentRung(client: LanguageClient, editor: vscode.TextEditor): Promise<void> {
  const uri = client.code2ProtocolConverter.asUri(editor.document.uri);
  const ladder = await client.sendRequest(LadderRequest, { uri });
  const line = rungLineAt(ladder, editor.selection.active.line);
  if (line === null) {
    void vscode.window.showInformationMessage('Rungs: put the cursor in a rung (below its == header) to sort it.');
    return;
  }
  await client.sendRequest(ExecuteCommandRequest.type, { command: SERVER_SORT_RUNG, arguments: [uri, line] });
}

/**
 * Workspace-wide diagnostics. The client opens every `*.rungs` file of the workspace as a text
 * document (not in an editor); the language server analyses each opened document and publishes
 * its diagnostics as it does for files in editors, so the one analysis path stays the server's.
 * The server clears a document's diagnostics when it closes, and VS Code closes unused documents
 * after a while, so for the files checked here that clearing is ignored while the file is closed
 * (see `keepDiagnostics`), and a change on disk opens the file again to check it afresh.
 */
export class WorkspaceCheck implements vscode.Disposable {
  private readonly checked = new Set<string>();
  private readonly waiting = new Map<string, () => void>();
  private readonly watcher: vscode.FileSystemWatcher;

  constructor(private readonly getClient: () => LanguageClient | undefined) {
    this.watcher = vscode.workspace.createFileSystemWatcher('**/*.rungs');
    this.watcher.onDidChange((uri) => {
      if (this.checked.has(uri.toString()) && !isOpen(uri)) void this.open([uri]);
    });
    this.watcher.onDidDelete((uri) => {
      if (this.checked.delete(uri.toString())) this.getClient()?.diagnostics?.delete(uri);
    });
  }

  /** Middleware test: false when an empty publish for a checked, closed file should be ignored. */
  keepDiagnostics(uri: vscode.Uri, diagnostics: readonly vscode.Diagnostic[]): boolean {
    return diagnostics.length === 0 && this.checked.has(uri.toString()) && !isOpen(uri);
  }

  onDidAnalyze(uri: string): void {
    this.waiting.get(uri)?.();
  }

  async run(): Promise<number> {
    const files = await vscode.workspace.findFiles('**/*.rungs', '**/{node_modules,.git}/**', 5000);
    await vscode.window.withProgress(
      { location: vscode.ProgressLocation.Notification, title: 'Rungs: scoring the workspace', cancellable: true },
      async (progress, token) => {
        for (let i = 0; i < files.length && !token.isCancellationRequested; i += 20) {
          const batch = files.slice(i, i + 20);
          progress.report({ message: `${i + batch.length} of ${files.length} scripts`, increment: (100 * batch.length) / files.length });
          await this.open(batch);
        }
      },
    );
    // Not awaited: the message stays until dismissed, and the command is done already.
    void vscode.window
      .showInformationMessage(
        `Rungs: scored ${files.length} script${files.length === 1 ? '' : 's'}; their problems are in the Problems panel.`,
        'Show Problems',
      )
      .then((choice) => choice && vscode.commands.executeCommand('workbench.actions.view.problems'));
    return files.length;
  }

  /** Opens documents and waits (up to 20 s) until the server reports each one analysed. */
  private async open(all: vscode.Uri[]): Promise<void> {
    // Documents already open have been analysed and stay so; only the others are waited for.
    const uris = all.filter((u) => !isOpen(u));
    for (const u of all) this.checked.add(u.toString());
    const done = uris.map(
      (uri) =>
        new Promise<void>((resolve) => {
          const key = uri.toString();
          const timer = setTimeout(finish, 20_000);
          function finish(): void {
            clearTimeout(timer);
            resolve();
          }
          this.waiting.set(key, () => {
            this.waiting.delete(key);
            finish();
          });
        }),
    );
    for (const uri of uris) {
      this.checked.add(uri.toString());
      try {
        await vscode.workspace.openTextDocument(uri);
      } catch {
        this.waiting.get(uri.toString())?.();
      }
    }
    await Promise.all(done);
  }

  dispose(): void {
    this.watcher.dispose();
    for (const f of this.waiting.values()) f();
  }
}

function isOpen(uri: vscode.Uri): boolean {
  const key = uri.toString();
  return vscode.workspace.textDocuments.some((d) => d.uri.toString() === key);
}
