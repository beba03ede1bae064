// The language server's lifecycle: initialisation and capabilities, settings and watched files,
// and open documents. The connection (connection.ts), publishing (publisher.ts) and the
// features (features.ts) live beside it. The server logs only through the client's console
// (window/logMessage), never to stdout, which carries the protocol.
import {
  CodeActionKind,
  TextDocumentSyncKind,
  TextDocuments,
  type ClientCapabilities,
  type Connection,
  type InitializeResult,
} from 'vscode-languageserver/node';
import { setFlagsFromString } from 'node:v8';
import { VERSION } from '../version';
import { FIX_ALL_KIND } from './codeActions';
import { SORT_RUNG_COMMAND } from './codeLens';
import { loadWordData, openConnection } from './connection';
import { DELIVERY_COMMANDS } from './delivery';
import { AnalysisStore } from './documents';
import { registerFeatures } from './features';
import { DidAnalyzeNotification } from './ladder';
import { Publisher } from './publisher';
import { RecordsDocuments } from './recordsDocuments';
import { SafeTextDocument } from './safeTextDocument';
import { LEGEND } from './semanticTokens';
import { normalizeSettings } from './settings';
import { isConfigFile, uriPaths } from './watch';

export { PUBLISH_DELAY_MS } from './publisher';

/**
 * Starts the server on the transport named in the process arguments (stdio when none is named).
 * The caller passes them: the CLI edge (`rungs lsp`) or the bundle's entry (lsp/main.ts).
 */
export function startServer(argv: readonly string[]): Connection {
  // The server lives as long as the editor and makes short-lived garbage on every keystroke: its
  // young generation is kept at the runtime's initial size rather than left to grow to tens of
  // megabytes. Measured with the benchmark's 10,000-item script (README "Speed"): about 30-40 MB
  // less resident memory, edit latency unchanged within noise, a little more collector time.
  setFlagsFromString('--semi-space-growth-factor=1');
  const connection = openConnection(argv);
  // Changes are clamped to the document before they are applied (lsp/safeTextDocument.ts).
  const documents = new TextDocuments(SafeTextDocument);
  const data = loadWordData(connection);
  const store = new AnalysisStore(data, {
    log: (m) => connection.console.log(m),
    error: (m) => connection.console.error(m),
    analyzed: (s) => void connection.sendNotification(DidAnalyzeNotification, { uri: s.uri, version: s.version }),
  });
  const publisher = new Publisher(connection, documents, store);
  const records = new RecordsDocuments(connection, documents, data, publisher.published, (uri, path) => store.editorLayer(uri, path));
  publisher.records = records;
  let caps: ClientCapabilities = {};
  let configurationSupport = false;

  async function refreshSettings(uri: string): Promise<boolean> {
    if (!configurationSupport) return false;
    try {
      const raw: unknown = await connection.workspace.getConfiguration({ scopeUri: uri, section: 'rungs' });
      const { settings, warnings } = normalizeSettings(raw);
      for (const w of warnings) connection.console.warn(w);
      return store.setSettings(uri, settings);
    } catch (err) {
      connection.console.warn(`could not read settings for ${uri}: ${String(err)}`);
      return false;
    }
  }
  async function recheckAll(): Promise<void> {
    store.invalidate();
    records.index.reset();
    for (const doc of documents.all()) await refreshSettings(doc.uri);
    for (const doc of documents.all()) publisher.publish(doc.uri, false);
    publisher.publishFiles();
    const ws = caps.workspace;
    if (ws?.inlayHint?.refreshSupport) void connection.languages.inlayHint.refresh().catch(() => undefined);
    if (ws?.semanticTokens?.refreshSupport) connection.languages.semanticTokens.refresh();
    if (ws?.codeLens?.refreshSupport) void connection.sendRequest('workspace/codeLens/refresh').catch(() => undefined);
  }

  connection.onInitialize((params): InitializeResult => {
    caps = params.capabilities;
    publisher.caps = caps;
    configurationSupport = Boolean(caps.workspace?.configuration);
    const folders = params.workspaceFolders?.map((f) => f.uri) ?? (params.rootUri ? [params.rootUri] : []);
    store.workspaceFolders = uriPaths(folders);
    return {
      capabilities: {
        textDocumentSync: { openClose: true, change: TextDocumentSyncKind.Incremental, save: false },
        hoverProvider: true,
        inlayHintProvider: { resolveProvider: false },
        codeLensProvider: { resolveProvider: false },
        codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix, CodeActionKind.RefactorRewrite, FIX_ALL_KIND] },
        completionProvider: { triggerCharacters: ['@', ' ', ',', '='], resolveProvider: false },
        signatureHelpProvider: { triggerCharacters: [' '], retriggerCharacters: [','] },
        documentSymbolProvider: true,
        foldingRangeProvider: true,
        semanticTokensProvider: { legend: LEGEND, full: true, range: false },
        documentFormattingProvider: true,
        executeCommandProvider: { commands: [SORT_RUNG_COMMAND, ...DELIVERY_COMMANDS] },
        workspace: { workspaceFolders: { supported: true, changeNotifications: true } },
      },
      serverInfo: { name: 'rungs', version: VERSION },
    };
  });

  connection.onInitialized(() => {
    connection.console.log('Rungs language server ready');
    if (caps.workspace?.didChangeConfiguration?.dynamicRegistration) {
      void connection.client.register(
        { method: 'workspace/didChangeConfiguration' } as never,
        { section: 'rungs' } as never,
      ).catch(() => undefined);
    }
    publisher.updateWatchers();
    if (caps.workspace?.workspaceFolders) {
      // Editor lexicon paths are relative to the folder holding the script, so a change of
      // folders can change what a script is checked with.
      connection.workspace.onDidChangeWorkspaceFolders((e) => {
        const removed = new Set(uriPaths(e.removed.map((f) => f.uri)));
        const kept = store.workspaceFolders.filter((f) => !removed.has(f));
        store.workspaceFolders = [...kept, ...uriPaths(e.added.map((f) => f.uri)).filter((f) => !kept.includes(f))];
        void recheckAll();
      });
    }
  });

  connection.onDidChangeConfiguration((change) => {
    if (!configurationSupport) {
      const raw = (change.settings as { rungs?: unknown } | null)?.rungs;
      const { settings, warnings } = normalizeSettings(raw);
      for (const w of warnings) connection.console.warn(w);
      store.invalidate();
      records.index.reset();
      for (const doc of documents.all()) store.setSettings(doc.uri, settings);
      for (const doc of documents.all()) publisher.publish(doc.uri, false);
      publisher.publishFiles();
      return;
    }
    void recheckAll();
  });
  // Clients may report any file (a broad watcher, or one by name only): re-check when a config
  // file changed, or a file an open script's config or settings resolved to (a lexicon).
  connection.onDidChangeWatchedFiles((p) => {
    const paths = uriPaths(p.changes.map((c) => c.uri));
    records.index.changed(paths);
    if (paths.some((f) => isConfigFile(f) || store.dependsOn(f))) void recheckAll();
  });

  documents.onDidOpen((e) => {
    // Publish at once with the settings in hand, again if the client's settings differ.
    publisher.publish(e.document.uri);
    void refreshSettings(e.document.uri).then((changed) => {
      if (changed) publisher.publish(e.document.uri);
    });
  });
  documents.onDidChangeContent((e) => {
    if (publisher.published.has(e.document.uri)) publisher.schedule(e.document.uri);
  });
  documents.onDidClose((e) => {
    store.close(e.document.uri);
    publisher.closed(e.document.uri);
  });

  registerFeatures(connection, documents, store, records, () => caps);

  documents.listen(connection);
  connection.listen();
  return connection;
}
