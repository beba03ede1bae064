// The language features on the protocol: each request handler reads the analysis of the document
// as the client last sent it and calls one feature module. Every handler is guarded, so an
// exception becomes a logged error and an empty answer.
import { CancellationToken, LSPErrorCodes, RequestType, ResponseError, type ClientCapabilities, type Connection, type TextDocuments } from 'vscode-languageserver/node';
import type { TextDocument } from 'vscode-languageserver-textdocument';
import { codeActions } from './codeActions';
import { codeLenses, SORT_RUNG_COMMAND } from './codeLens';
import { completion, signatureHelp } from './completion';
import { describeError } from './connection';
import { DELIVERY_COMMANDS, runDelivery } from './delivery';
import { toLspTextEdit } from './convert';
import type { AnalysisStore, Snapshot } from './documents';
import { formatDocument } from './formatScript';
import { hover } from './hover';
import { inlayHints } from './inlay';
import { itemAt, ItemAtRequest, ladder, LadderRequest } from './ladder';
import { ReportRequest, scriptReport } from './report';
import { PROGRESS_METHOD, type ProgressView } from './contract';
import { progressView, recordsHover, recordsLenses } from './records';
import type { RecordsDocuments } from './recordsDocuments';
import { semanticTokens } from './semanticTokens';
import { sortRung } from './sortRung';
import { documentSymbols, foldingRanges } from './symbols';

export function registerFeatures(
  connection: Connection,
  documents: TextDocuments<TextDocument>,
  store: AnalysisStore,
  records: RecordsDocuments,
  caps: () => ClientCapabilities,
): void {
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
        connection.console.error(`${name} failed: ${describeError(err)}`);
        return fallback;
      }
    };
  }
  /** The analysis of the document as the client last sent it (never a stale one). */
  const snap = (uri: string): Snapshot | null => {
    const doc = documents.get(uri);
    return doc && !records.isRecords(uri) ? store.get(doc) : null;
  };
  /** A handler on a document's analysis, with the fallback when the document is not open. */
  const on = <P, R>(name: string, fallback: R, uriOf: (p: P) => string, fn: (s: Snapshot, p: P) => R) =>
    guard<P, R>(name, fallback, (p) => {
      const s = snap(uriOf(p));
      return s ? fn(s, p) : fallback;
    });
  type Doc = { textDocument: { uri: string } };
  const docUri = <P extends Doc>(p: P) => p.textDocument.uri;

  connection.onHover(guard('hover', null, (p) => {
    const uri = p.textDocument.uri;
    if (records.isRecords(uri)) {
      const r = records.get(uri);
      return r ? recordsHover(r.result, r.mark, p.position.line) : null;
    }
    const s = snap(uri);
    if (!s) return null;
    const h = hover(s, p.position.line, p.position.character);
    return records.addRungNote(h, uri, s.rungAtHeader(p.position.line)?.index, store.workspaceFolders);
  }));
  connection.languages.inlayHint.on(on('inlayHint', [], docUri, (s, p) => inlayHints(s, p.range)));
  connection.onCodeLens(guard('codeLens', [], (p) => {
    if (records.isRecords(p.textDocument.uri)) {
      const r = records.get(p.textDocument.uri);
      return r ? recordsLenses(r.result) : [];
    }
    const s = snap(p.textDocument.uri);
    return s ? codeLenses(s) : [];
  }));
  connection.onCodeAction(on('codeAction', [], docUri, (s, p) => codeActions(s, p)));
  connection.onCompletion(on('completion', [], docUri, (s, p) => completion(s, p.position.line, p.position.character)));
  connection.onSignatureHelp(on('signatureHelp', null, docUri, (s, p) => signatureHelp(s, p.position.line, p.position.character)));
  connection.onDocumentSymbol(on('documentSymbol', [], docUri, (s) => documentSymbols(s)));
  connection.onFoldingRanges(on('foldingRange', [], docUri, (s) => foldingRanges(s)));
  connection.languages.semanticTokens.on(on('semanticTokens', { data: [] }, docUri, (s) => semanticTokens(s)));
  connection.onDocumentFormatting(guard('formatting', [], (p) => {
    const doc = documents.get(p.textDocument.uri);
    return doc && !records.isRecords(p.textDocument.uri) ? formatDocument(doc.getText()) : [];
  }));
  connection.onRequest(LadderRequest, on('rungs/ladder', null, (p) => p.uri, (s) => ladder(s)));
  connection.onRequest(new RequestType<{ uri: string }, ProgressView | null, void>(PROGRESS_METHOD), guard('rungs/progress', null, (p) => {
    const r = records.isRecords(p.uri) ? records.get(p.uri) : null;
    return r ? progressView(r.result, r.mark) : null;
  }));
  connection.onRequest(ItemAtRequest, on('rungs/itemAt', null, (p) => p.uri, (s, p) => itemAt(s, p.line)));
  connection.onRequest(ReportRequest, on('rungs/report', null, (p) => p.uri, (s) => scriptReport(s)));

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
      const edit = caps().workspace?.workspaceEdit?.documentChanges
        ? { documentChanges: [{ textDocument: { uri, version: s.version }, edits }] }
        : { changes: { [uri]: edits } };
      const r = await connection.workspace.applyEdit({ label: `Sort rung "${rung!.node.name}" by difficulty`, edit });
      return { applied: r.applied };
    } catch (err) {
      connection.console.error(`${SORT_RUNG_COMMAND} failed: ${describeError(err)}`);
      return { applied: false };
    }
  });
}
