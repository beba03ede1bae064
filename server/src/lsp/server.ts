// The language server: wires the features to the protocol. Every handler is guarded, so an
// exception becomes a logged error and an empty answer; the server logs only through the
// client's console (window/logMessage), never to stdout, which carries the protocol.
import {
  CancellationToken,
  CodeActionKind,
  createConnection,
  DidChangeWatchedFilesNotification,
  LSPErrorCodes,
  MarkupKind,
  ProposedFeatures,
  RequestType,
  ResponseError,
  StreamMessageReader,
  StreamMessageWriter,
  TextDocumentSyncKind,
  TextDocuments,
  type ClientCapabilities,
  type Connection,
  type Disposable,
  type InitializeResult,
} from 'vscode-languageserver/node';
import { dirname } from 'node:path';
import { pathToFileURL } from 'node:url';
import { SafeTextDocument } from './safeTextDocument';
import type { WordData } from '../core/types';
import { loadWordTable } from '../data/wordTable';
import { codeActions, FIX_ALL_KIND } from './codeActions';
import { codeLenses, SORT_RUNG_COMMAND } from './codeLens';
import { DELIVERY_COMMANDS, runDelivery } from './delivery';
import { completion, signatureHelp } from './completion';
import { toLspDiagnostic, toLspTextEdit } from './convert';
import { AnalysisStore, type Snapshot } from './documents';
import { formatDocument } from './formatting';
import { hover } from './hover';
import { inlayHints } from './inlay';
import { DidAnalyzeNotification, itemAt, ItemAtRequest, ladder, LadderRequest } from './ladder';
import { ReportRequest, scriptReport } from './report';
import { LEGEND, semanticTokens } from './semanticTokens';
import { normalizeSettings } from './settings';
import { sortRung } from './sortRung';
import { documentSymbols, foldingRanges } from './symbols';
import { AdaptiveDelay } from './debounce';
import { fileWatchers, uriPaths, isConfigFile } from './watch';
import { PROGRESS_METHOD, type ProgressView } from './contract';
import { findRecordsFiles, isRecordsPath, progressView, recordsHover, recordsLenses, recordsProgress, rungRecordsNote } from './records';
import { uriToPath } from './documents';
import type { ProgressResult } from '../core/records';

/** Longest quiet time after the last keystroke before diagnostics are published again. */
export const PUBLISH_DELAY_MS = 150;

const TRANSPORT_FLAGS = ['--stdio', '--node-ipc', '--socket', '--pipe', '--clientProcessId'];

function emptyData(): WordData {
  return { pronunciations: () => undefined, count: () => 0 };
}

/** Starts the server on the transport named in argv (stdio when none is named). */
export function startServer(): Connection {
  const named = process.argv.some((a) => TRANSPORT_FLAGS.some((f) => a === f || a.startsWith(`${f}=`)));
  const connection = named
    ? createConnection(ProposedFeatures.all)
    : createConnection(ProposedFeatures.all, new StreamMessageReader(process.stdin), new StreamMessageWriter(process.stdout));
  // Anything that still calls console.* must not write into the protocol stream.
  console.log = (...a: unknown[]) => connection.console.log(a.map(String).join(' '));
  console.info = (...a: unknown[]) => connection.console.info(a.map(String).join(' '));
  console.warn = (...a: unknown[]) => connection.console.warn(a.map(String).join(' '));
  console.error = (...a: unknown[]) => connection.console.error(a.map(String).join(' '));
  process.on('uncaughtException', (e) => connection.console.error(`uncaught: ${e.stack ?? e.message}`));
  process.on('unhandledRejection', (e) => connection.console.error(`unhandled rejection: ${String(e)}`));

  let data: WordData;
  try {
    data = loadWordTable();
  } catch (err) {
    data = emptyData();
    setImmediate(() =>
      connection.console.error(`word tables not loaded (${err instanceof Error ? err.message : String(err)}); every word is estimated`),
    );
  }

  // Changes are clamped to the document before they are applied (lsp/safeTextDocument.ts).
  const documents = new TextDocuments(SafeTextDocument);
  const store = new AnalysisStore(data, {
    log: (m) => connection.console.log(m),
    error: (m) => connection.console.error(m),
    analyzed: (s) => void connection.sendNotification(DidAnalyzeNotification, { uri: s.uri, version: s.version }),
  });
  let caps: ClientCapabilities = {};
  let configurationSupport = false;
  const timers = new Map<string, NodeJS.Timeout>();
  const publishDelay = new AdaptiveDelay(PUBLISH_DELAY_MS);
  const published = new Map<string, number>();

  const cancelled = () => new ResponseError(LSPErrorCodes.RequestCancelled, 'request cancelled');
  // Handlers run synchronously, so a `$/cancelRequest` can only be seen before one starts: the
  // connection marks a request cancelled when its cancellation arrives while it is still queued
  // (typing fast queues several), and such a request is answered RequestCancelled unrun. A check
  // after or inside a synchronous handler could never fire, so there is none.
  function guard<P, R>(name: string, fallback: R, fn: (p: P) => R) {
    return (p: P, token?: CancellationToken): R | ResponseError<void> => {
      if ((token ?? CancellationToken.None).isCancellationRequested) return cancelled();
      try {
        return fn(p);
      } catch (err) {
        connection.console.error(`${name} failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
        return fallback;
      }
    };
  }
  // Rate records files (*.rates.csv, or the records language) are not scripts: they get their
  // own diagnostics, hover, lenses and progress view, and no script feature.
  const isRecords = (uri: string): boolean => documents.get(uri)?.languageId === 'rungs-records' || isRecordsPath(uriToPath(uri));
  const openText = (path: string): string | undefined => documents.get(pathToFileURL(path).href)?.getText();
  const recordsCache = new Map<string, { version: number; result: ProgressResult; mark: number }>();
  function records(uri: string): { result: ProgressResult; mark: number } | null {
    const doc = documents.get(uri);
    if (!doc) return null;
    const hit = recordsCache.get(uri);
    if (hit && hit.version === doc.version) return hit;
    const path = uriToPath(uri) ?? '/untitled.rates.csv';
    const r = { version: doc.version, ...recordsProgress(path, doc.getText(), openText, data) };
    recordsCache.set(uri, r);
    return r;
  }
  function publishRecords(uri: string): void {
    const r = records(uri);
    const doc = documents.get(uri);
    if (!r || !doc) return;
    published.set(uri, doc.version);
    void connection.sendDiagnostics({ uri, version: doc.version, diagnostics: r.result.problems.map((p) => toLspDiagnostic(p, uri)) });
    void connection.sendNotification(DidAnalyzeNotification, { uri, version: doc.version });
  }
  /** Records depend on the scripts they name: re-read open records files after a script changed. */
  function refreshRecords(): void {
    for (const doc of documents.all()) {
      if (!isRecords(doc.uri) || !published.has(doc.uri)) continue;
      recordsCache.delete(doc.uri);
      publishRecords(doc.uri);
    }
  }

  /** The analysis of the document as the client last sent it (never a stale one). */
  const snap = (uri: string): Snapshot | null => {
    const doc = documents.get(uri);
    return doc && !isRecords(uri) ? store.get(doc) : null;
  };

  /** Publishes a script's diagnostics; `andFiles` also those of config and lexicon files. */
  function publish(uri: string, andFiles = true): void {
    timers.delete(uri);
    try {
      const doc = documents.get(uri);
      if (!doc) return;
      if (isRecords(uri)) {
        publishRecords(uri);
        return;
      }
      const s = store.get(doc);
      published.set(uri, s.version);
      void connection.sendDiagnostics({ uri, version: s.version, diagnostics: s.problems.map((p) => toLspDiagnostic(p, uri)) });
      if (andFiles) publishFiles();
      refreshRecords();
    } catch (err) {
      connection.console.error(`publishing diagnostics for ${uri} failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
    }
  }

  // Config and lexicon files are not open scripts, so their problems are published on their own
  // URIs: again only when they differ from what was sent, and cleared once fixed or unused.
  let filesPublished = new Map<string, string>();
  function publishFiles(): void {
    try {
      const next = new Map<string, string>();
      for (const [file, problems] of store.fileProblems()) {
        const uri = pathToFileURL(file).href;
        if (documents.get(uri)) continue; // An open document's diagnostics are its own analysis.
        const diagnostics = problems.map((p) => toLspDiagnostic(p, uri));
        const key = JSON.stringify(diagnostics);
        next.set(uri, key);
        if (filesPublished.get(uri) !== key) void connection.sendDiagnostics({ uri, diagnostics });
      }
      for (const uri of filesPublished.keys()) if (!next.has(uri)) void connection.sendDiagnostics({ uri, diagnostics: [] });
      filesPublished = next;
      updateWatchers();
    } catch (err) {
      connection.console.error(`publishing config diagnostics failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
    }
  }

  // Watchers follow the lexicons the open scripts use: re-registered whenever that set changes.
  let watcherKey = '';
  let watcherRegistration: Promise<Disposable | undefined> = Promise.resolve(undefined);
  function updateWatchers(): void {
    const watched = caps.workspace?.didChangeWatchedFiles;
    if (!watched?.dynamicRegistration) return;
    const watchers = fileWatchers(store.lexiconPaths(isConfigFile), Boolean(watched.relativePatternSupport));
    const key = JSON.stringify(watchers);
    if (key === watcherKey) return;
    watcherKey = key;
    watcherRegistration = watcherRegistration.then(async (old) => {
      old?.dispose();
      try {
        return await connection.client.register(DidChangeWatchedFilesNotification.type, { watchers });
      } catch (e) {
        connection.console.warn(`file watching not registered: ${String(e)}`);
        return undefined;
      }
    });
  }
  function schedule(uri: string, delay = publishDelay.next()): void {
    clearTimeout(timers.get(uri));
    timers.set(
      uri,
      setTimeout(() => {
        // What an edit's re-check costs sets the wait after the next keystroke (opening a
        // script is a cold start, not an edit, so it does not count).
        const t0 = performance.now();
        publish(uri);
        publishDelay.record(performance.now() - t0);
      }, delay),
    );
  }

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
    for (const doc of documents.all()) await refreshSettings(doc.uri);
    for (const doc of documents.all()) publish(doc.uri, false);
    publishFiles();
    const ws = caps.workspace;
    if (ws?.inlayHint?.refreshSupport) void connection.languages.inlayHint.refresh().catch(() => undefined);
    if (ws?.semanticTokens?.refreshSupport) connection.languages.semanticTokens.refresh();
    if (ws?.codeLens?.refreshSupport) void connection.sendRequest('workspace/codeLens/refresh').catch(() => undefined);
  }

  connection.onInitialize((params): InitializeResult => {
    caps = params.capabilities;
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
      serverInfo: { name: 'rungs', version: '0.1.0' },
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
    updateWatchers();
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
      for (const doc of documents.all()) store.setSettings(doc.uri, settings);
      for (const doc of documents.all()) publish(doc.uri, false);
      publishFiles();
      return;
    }
    void recheckAll();
  });
  // Clients may report any file (a broad watcher, or one by name only): re-check when a config
  // file changed, or a file an open script's config or settings resolved to (a lexicon).
  connection.onDidChangeWatchedFiles((p) => {
    const paths = uriPaths(p.changes.map((c) => c.uri));
    if (paths.some((f) => isConfigFile(f) || store.dependsOn(f))) void recheckAll();
  });

  documents.onDidOpen((e) => {
    // Publish at once with the settings in hand, again if the client's settings differ.
    publish(e.document.uri);
    void refreshSettings(e.document.uri).then((changed) => {
      if (changed) publish(e.document.uri);
    });
  });
  documents.onDidChangeContent((e) => {
    if (published.has(e.document.uri)) schedule(e.document.uri);
  });
  documents.onDidClose((e) => {
    clearTimeout(timers.get(e.document.uri));
    timers.delete(e.document.uri);
    published.delete(e.document.uri);
    recordsCache.delete(e.document.uri);
    store.close(e.document.uri);
    void connection.sendDiagnostics({ uri: e.document.uri, diagnostics: [] });
    publishFiles();
  });

  connection.onHover(guard('hover', null, (p) => {
    if (isRecords(p.textDocument.uri)) {
      const r = records(p.textDocument.uri);
      return r ? recordsHover(r.result, r.mark, p.position.line) : null;
    }
    const s = snap(p.textDocument.uri);
    const h = s ? hover(s, p.position.line, p.position.character) : null;
    // A rung header's hover also shows the latest ratio of each client whose records name it.
    const rung = s?.rungAtHeader(p.position.line);
    const path = uriToPath(p.textDocument.uri);
    if (h && rung && path && typeof h.contents === 'object' && 'kind' in h.contents && h.contents.kind === MarkupKind.Markdown) {
      const note = rungRecordsNote(path, rung.index, findRecordsFiles(store.workspaceFolders.length ? store.workspaceFolders : [dirname(path)]), openText);
      if (note.length) h.contents.value += `\n${note.join('\n')}`;
    }
    return h;
  }));
  connection.languages.inlayHint.on(guard('inlayHint', [], (p) => {
    const s = snap(p.textDocument.uri);
    return s ? inlayHints(s, p.range) : [];
  }));
  connection.onCodeLens(guard('codeLens', [], (p) => {
    if (isRecords(p.textDocument.uri)) {
      const r = records(p.textDocument.uri);
      return r ? recordsLenses(r.result) : [];
    }
    const s = snap(p.textDocument.uri);
    return s ? codeLenses(s) : [];
  }));
  connection.onCodeAction(guard('codeAction', [], (p) => {
    const s = snap(p.textDocument.uri);
    return s ? codeActions(s, p) : [];
  }));
  connection.onCompletion(guard('completion', [], (p) => {
    const s = snap(p.textDocument.uri);
    return s ? completion(s, p.position.line, p.position.character) : [];
  }));
  connection.onSignatureHelp(guard('signatureHelp', null, (p) => {
    const s = snap(p.textDocument.uri);
    return s ? signatureHelp(s, p.position.line, p.position.character) : null;
  }));
  connection.onDocumentSymbol(guard('documentSymbol', [], (p) => {
    const s = snap(p.textDocument.uri);
    return s ? documentSymbols(s) : [];
  }));
  connection.onFoldingRanges(guard('foldingRange', [], (p) => {
    const s = snap(p.textDocument.uri);
    return s ? foldingRanges(s) : [];
  }));
  connection.languages.semanticTokens.on(guard('semanticTokens', { data: [] }, (p) => {
    const s = snap(p.textDocument.uri);
    return s ? semanticTokens(s) : { data: [] };
  }));
  connection.onDocumentFormatting(guard('formatting', [], (p) => {
    const doc = documents.get(p.textDocument.uri);
    return doc && !isRecords(p.textDocument.uri) ? formatDocument(doc.getText()) : [];
  }));
  connection.onRequest(LadderRequest, guard('rungs/ladder', null, (p) => {
    const s = snap(p.uri);
    return s ? ladder(s) : null;
  }));
  connection.onRequest(new RequestType<{ uri: string }, ProgressView | null, void>(PROGRESS_METHOD), guard('rungs/progress', null, (p) => {
    const r = isRecords(p.uri) ? records(p.uri) : null;
    return r ? progressView(r.result, r.mark) : null;
  }));
  connection.onRequest(ReportRequest, guard('rungs/report', null, (p) => {
    const s = snap(p.uri);
    return s ? scriptReport(s) : null;
  }));
  connection.onRequest(ItemAtRequest, guard('rungs/itemAt', null, (p) => {
    const s = snap(p.uri);
    return s ? itemAt(s, p.line) : null;
  }));

  connection.onExecuteCommand(async (p) => {
    try {
      if (DELIVERY_COMMANDS.includes(p.command)) {
        const [uri, line] = (p.arguments ?? []) as [string, number];
        const s = typeof uri === 'string' ? snap(uri) : null;
        if (!s || typeof line !== 'number') return { ok: false, message: 'open the script and put the cursor in a rung' };
        try {
          return runDelivery(p.command, s, line);
        } catch (err) {
          return { ok: false, message: err instanceof Error ? err.message : String(err) };
        }
      }
      if (p.command !== SORT_RUNG_COMMAND) return null;
      const [uri, line] = (p.arguments ?? []) as [string, number];
      const s = typeof uri === 'string' ? snap(uri) : null;
      if (!s || typeof line !== 'number') return { applied: false };
      const rung = s.rungAtHeader(line) ?? s.rungContaining(line);
      const e = rung ? sortRung(s, rung) : null;
      if (!e) return { applied: false };
      const edits = [toLspTextEdit(e)];
      const edit = caps.workspace?.workspaceEdit?.documentChanges
        ? { documentChanges: [{ textDocument: { uri, version: s.version }, edits }] }
        : { changes: { [uri]: edits } };
      const r = await connection.workspace.applyEdit({ label: `Sort rung "${rung!.node.name}" by difficulty`, edit });
      return { applied: r.applied };
    } catch (err) {
      connection.console.error(`${SORT_RUNG_COMMAND} failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
      return { applied: false };
    }
  });

  documents.listen(connection);
  connection.listen();
  return connection;
}
