// Publishing diagnostics: a script's own after a quiet time following the last keystroke, and the
// problems of config and lexicon files on those files' URIs (sent again only when they differ,
// cleared once fixed or unused). File watchers follow the lexicons the open scripts use.
import { pathToFileURL } from 'node:url';
import { DidChangeWatchedFilesNotification, type ClientCapabilities, type Connection, type Disposable, type TextDocuments } from 'vscode-languageserver/node';
import type { TextDocument } from 'vscode-languageserver-textdocument';
import { describeError } from './connection';
import { toLspDiagnostic } from './convert';
import { diagnosticsOf } from './diagnostics';
import type { AnalysisStore } from './documents';
import type { RecordsDocuments } from './recordsDocuments';
import { fileWatchers, isConfigFile } from './watch';
import { AdaptiveDelay } from './debounce';

/** Longest quiet time after the last keystroke before diagnostics are published again. */
export const PUBLISH_DELAY_MS = 150;

export class Publisher {
  private readonly timers = new Map<string, NodeJS.Timeout>();
  private readonly publishDelay = new AdaptiveDelay(PUBLISH_DELAY_MS);
  /** Scripts published at least once, with the version sent. */
  readonly published = new Map<string, number>();
  private filesPublished = new Map<string, string>();
  private watcherKey = '';
  private watcherRegistration: Promise<Disposable | undefined> = Promise.resolve(undefined);
  caps: ClientCapabilities = {};
  /** Set once the records side exists (it shares `published`). */
  records?: RecordsDocuments;

  constructor(
    private readonly connection: Connection,
    private readonly documents: TextDocuments<TextDocument>,
    private readonly store: AnalysisStore,
  ) {}

  /** Publishes a script's diagnostics; `andFiles` also those of config and lexicon files. */
  publish(uri: string, andFiles = true): void {
    this.timers.delete(uri);
    try {
      const doc = this.documents.get(uri);
      if (!doc) return;
      if (this.records?.isRecords(uri)) {
        this.records.publish(uri);
        return;
      }
      const s = this.store.get(doc);
      this.published.set(uri, s.version);
      void this.connection.sendDiagnostics({ uri, version: s.version, diagnostics: diagnosticsOf(s.problems, uri) });
      if (andFiles) this.publishFiles();
      this.records?.refresh();
    } catch (err) {
      this.connection.console.error(`publishing diagnostics for ${uri} failed: ${describeError(err)}`);
    }
  }

  publishFiles(): void {
    try {
      const next = new Map<string, string>();
      for (const [file, problems] of this.store.fileProblems()) {
        const uri = pathToFileURL(file).href;
        if (this.documents.get(uri)) continue; // An open document's diagnostics are its own analysis.
        const diagnostics = problems.map((p) => toLspDiagnostic(p, uri));
        const key = JSON.stringify(diagnostics);
        next.set(uri, key);
        if (this.filesPublished.get(uri) !== key) void this.connection.sendDiagnostics({ uri, diagnostics });
      }
      for (const uri of this.filesPublished.keys()) if (!next.has(uri)) void this.connection.sendDiagnostics({ uri, diagnostics: [] });
      this.filesPublished = next;
      this.updateWatchers();
    } catch (err) {
      this.connection.console.error(`publishing config diagnostics failed: ${describeError(err)}`);
    }
  }

  /** Re-registers the file watchers whenever the set of lexicons in use changes. */
  updateWatchers(): void {
    const watched = this.caps.workspace?.didChangeWatchedFiles;
    if (!watched?.dynamicRegistration) return;
    const watchers = fileWatchers(this.store.lexiconPaths(isConfigFile), Boolean(watched.relativePatternSupport));
    const key = JSON.stringify(watchers);
    if (key === this.watcherKey) return;
    this.watcherKey = key;
    this.watcherRegistration = this.watcherRegistration.then(async (old) => {
      old?.dispose();
      try {
        return await this.connection.client.register(DidChangeWatchedFilesNotification.type, { watchers });
      } catch (e) {
        this.connection.console.warn(`file watching not registered: ${String(e)}`);
        return undefined;
      }
    });
  }

  schedule(uri: string, delay = this.publishDelay.next()): void {
    clearTimeout(this.timers.get(uri));
    this.timers.set(
      uri,
      setTimeout(() => {
        // What an edit's re-check costs sets the wait after the next keystroke (opening a
        // script is a cold start, not an edit, so it does not count).
        const t0 = performance.now();
        this.publish(uri);
        const t1 = performance.now();
        this.publishDelay.record(t1 - t0, t1);
      }, delay),
    );
  }

  /** A closed script: no pending publish, and its diagnostics cleared. */
  closed(uri: string): void {
    clearTimeout(this.timers.get(uri));
    this.timers.delete(uri);
    this.published.delete(uri);
    this.records?.forget(uri);
    void this.connection.sendDiagnostics({ uri, diagnostics: [] });
    this.publishFiles();
  }
}
