// Open rate-records files (*.rates.csv, or the records language) in the server: they are not
// scripts, so they get their own analysis (cached per version), diagnostics, hover, lenses and
// progress view, and no script feature. Records depend on the scripts they name, so open records
// files are re-read after a script changed.
import { dirname } from 'node:path';
import { pathToFileURL } from 'node:url';
import { MarkupKind, type Connection, type Hover, type TextDocuments } from 'vscode-languageserver/node';
import type { TextDocument } from 'vscode-languageserver-textdocument';
import type { ProgressResult } from '../core/records';
import type { WordData } from '../core/types';
import { uriToPath } from '../node/nodeFs';
import { toLspDiagnostic } from './convert';
import { DidAnalyzeNotification } from './ladder';
import { findRecordsFiles, isRecordsPath, readFileText, recordsProgress, today, type EditorLayer } from './records';
import { RecordsIndex, type RecordsFiles } from './recordsIndex';

export class RecordsDocuments {
  private readonly cache = new Map<string, { version: number; settings: string; result: ProgressResult; mark: number }>();
  /** What rung hovers show of the workspace's records, kept in memory. */
  readonly index: RecordsIndex;

  constructor(
    private readonly connection: Connection,
    private readonly documents: TextDocuments<TextDocument>,
    private readonly data: WordData,
    /** Versions published so far, shared with the script publisher. */
    private readonly published: Map<string, number>,
    /** A document's editor settings (rungs.*), layered below config files as for scripts. */
    private readonly editorFor: (uri: string, path: string | null) => EditorLayer,
    files: RecordsFiles = { read: readFileText, find: (folders) => findRecordsFiles(folders) },
  ) {
    this.index = new RecordsIndex(files, this.openText, () => today());
  }

  isRecords(uri: string): boolean {
    return this.documents.get(uri)?.languageId === 'rungs-records' || isRecordsPath(uriToPath(uri));
  }

  private openText = (path: string): string | undefined => this.documents.get(pathToFileURL(path).href)?.getText();

  /** The progress of an open records file, for its current version. */
  get(uri: string): { result: ProgressResult; mark: number } | null {
    const doc = this.documents.get(uri);
    if (!doc) return null;
    const editor = this.editorFor(uri, uriToPath(uri));
    // Read again when the text or the editor settings changed.
    const settings = JSON.stringify(editor?.settings ?? null);
    const hit = this.cache.get(uri);
    if (hit && hit.version === doc.version && hit.settings === settings) return hit;
    const path = uriToPath(uri) ?? '/untitled.rates.csv';
    const r = { version: doc.version, settings, ...recordsProgress(path, doc.getText(), this.openText, this.data, editor) };
    this.cache.set(uri, r);
    return r;
  }

  publish(uri: string): void {
    const r = this.get(uri);
    const doc = this.documents.get(uri);
    if (!r || !doc) return;
    this.published.set(uri, doc.version);
    void this.connection.sendDiagnostics({ uri, version: doc.version, diagnostics: r.result.problems.map((p) => toLspDiagnostic(p, uri)) });
    void this.connection.sendNotification(DidAnalyzeNotification, { uri, version: doc.version });
  }

  /** Re-reads open records files after a script changed. */
  refresh(): void {
    for (const doc of this.documents.all()) {
      if (!this.isRecords(doc.uri) || !this.published.has(doc.uri)) continue;
      this.cache.delete(doc.uri);
      this.publish(doc.uri);
    }
  }

  forget(uri: string): void {
    this.cache.delete(uri);
  }

  /**
   * A rung header's hover also shows the latest ratio of each client whose records name it,
   * answered from the index (lsp/recordsIndex.ts): nothing is read again until it changed.
   */
  addRungNote(h: Hover | null, scriptUri: string, rungIndex: number | undefined, workspaceFolders: string[]): Hover | null {
    const path = uriToPath(scriptUri);
    if (!h || rungIndex === undefined || !path || typeof h.contents !== 'object' || !('kind' in h.contents) || h.contents.kind !== MarkupKind.Markdown) return h;
    const note = this.index.note(path, rungIndex, workspaceFolders.length ? workspaceFolders : [dirname(path)], this.editorFor(scriptUri, path));
    if (note.length) h.contents.value += `\n${note.join('\n')}`;
    return h;
  }
}
