// The VS Code extension: starts the Rungs language server (dist/server.js, over IPC) and adds what
// an editor alone shows: the ladder view, the status bar item and the commands. Everything about
// the script itself (diagnostics, hovers, fixes, folding, colours beyond the grammar) comes from
// the server, so the editor, the CLI and CI agree.
import * as vscode from 'vscode';
import { LanguageClient, TransportKind, type LanguageClientOptions, type ServerOptions } from 'vscode-languageclient/node';
import { sortCurrentRung, WorkspaceCheck } from './commands';
import { LadderView } from './ladderView';
import { ProgressView, RECORDS_LANGUAGE } from './progressView';
import { DidAnalyzeNotification } from './protocol';
import { openReport } from './reportView';
import { ItemStatus } from './statusBar';
import { espeakFound, runDelivery } from './delivery';

let client: LanguageClient | undefined;

/** What activation returns: used by the extension-host tests. */
export interface RungsApi {
  getClient(): LanguageClient | undefined;
}

const SELECTOR = [
  { language: 'rungs', scheme: 'file' },
  { language: 'rungs', scheme: 'untitled' },
  { language: 'rungs', scheme: 'vscode-remote' },
  // Rate records (*.rates.csv): diagnostics, hovers and lenses from the same server.
  { language: RECORDS_LANGUAGE, scheme: 'file' },
  { language: RECORDS_LANGUAGE, scheme: 'untitled' },
  { language: RECORDS_LANGUAGE, scheme: 'vscode-remote' },
];

function activeRungsEditor(): vscode.TextEditor | undefined {
  const e = vscode.window.activeTextEditor;
  if (e?.document.languageId === 'rungs') return e;
  // The ladder view may have focus; fall back to a visible Rungs editor.
  return vscode.window.visibleTextEditors.find((v) => v.document.languageId === 'rungs');
}

export async function activate(context: vscode.ExtensionContext): Promise<RungsApi> {
  const module = context.asAbsolutePath('dist/server.js');
  const serverOptions: ServerOptions = {
    run: { module, transport: TransportKind.ipc },
    debug: { module, transport: TransportKind.ipc, options: { execArgv: ['--nolazy', '--inspect=6019'] } },
  };
  const getClient = (): LanguageClient | undefined => client;
  const workspaceCheck = new WorkspaceCheck(getClient);
  const clientOptions: LanguageClientOptions = {
    documentSelector: SELECTOR,
    // The server pulls the `rungs` section (workspace/configuration); this tells it to pull again
    // whenever a setting changes, so changes apply without a reload.
    synchronize: { configurationSection: 'rungs' },
    middleware: {
      handleDiagnostics(uri, diagnostics, next) {
        if (workspaceCheck.keepDiagnostics(uri, diagnostics)) return;
        next(uri, diagnostics);
      },
    },
  };
  client = new LanguageClient('rungs', 'Rungs', serverOptions, clientOptions);

  const ladder = new LadderView(getClient);
  const progress = new ProgressView(getClient);
  const status = new ItemStatus(getClient);
  client.onNotification(DidAnalyzeNotification, (p) => {
    const uri = vscode.Uri.parse(p.uri).toString();
    ladder.onDidAnalyze(uri);
    progress.onDidAnalyze(uri);
    status.onDidAnalyze(uri);
    workspaceCheck.onDidAnalyze(uri);
  });

  context.subscriptions.push(
    ladder,
    progress,
    status,
    workspaceCheck,
    vscode.commands.registerCommand('rungs.showLadder', async () => {
      const editor = activeRungsEditor();
      if (editor) await ladder.show(editor.document);
      else void vscode.window.showInformationMessage('Rungs: open a .rungs script to see its ladder.');
    }),
    vscode.commands.registerCommand('rungs.showProgress', async () => {
      const e = vscode.window.activeTextEditor?.document.languageId === RECORDS_LANGUAGE
        ? vscode.window.activeTextEditor
        : vscode.window.visibleTextEditors.find((v) => v.document.languageId === RECORDS_LANGUAGE);
      if (e) await progress.show(e.document);
      else void vscode.window.showInformationMessage('Rungs: open a rate records file (*.rates.csv) to see its progress.');
    }),
    vscode.commands.registerCommand('rungs.openReport', async () => {
      const editor = activeRungsEditor();
      if (editor && client) await openReport(client, editor.document, String(context.extension.packageJSON.version ?? ''));
      else void vscode.window.showInformationMessage('Rungs: open a .rungs script to see its report.');
    }),
    vscode.commands.registerCommand('rungs.sortCurrentRung', async () => {
      const editor = activeRungsEditor();
      if (editor && client) await sortCurrentRung(client, editor);
    }),
    vscode.commands.registerCommand('rungs.checkWorkspace', () => workspaceCheck.run()),
    ...(['cues', 'audio', 'practice'] as const).map((kind) =>
      vscode.commands.registerCommand(`rungs.delivery.${kind}`, async () => {
        const editor = activeRungsEditor();
        if (editor && client) await runDelivery(client, editor, kind);
      }),
    ),
    vscode.commands.registerCommand('rungs.restartServer', async () => {
      if (!client) return;
      await client.restart();
      status.schedule(0);
      void vscode.window.setStatusBarMessage('Rungs: language server restarted', 3000);
    }),
  );

  await client.start();
  await vscode.commands.executeCommand('setContext', 'rungs.active', true);
  await vscode.commands.executeCommand('setContext', 'rungs.espeakFound', espeakFound());
  status.schedule(0);
  return { getClient };
}

export async function deactivate(): Promise<void> {
  const c = client;
  client = undefined;
  if (c) await c.stop();
}
