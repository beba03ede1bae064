// A small LSP client for protocol tests: spawns `rungs lsp --stdio`, speaks JSON-RPC through
// vscode-languageserver-protocol's node client, answers the server's requests (configuration,
// registrations, applyEdit) and lets tests wait for the notifications they need. No sleeps.
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import {
  createProtocolConnection,
  StreamMessageReader,
  StreamMessageWriter,
  type ProtocolConnection,
} from 'vscode-languageserver-protocol/node';
import type {
  Diagnostic,
  InitializeResult,
  PublishDiagnosticsParams,
  TextDocumentContentChangeEvent,
  TextEdit,
  WorkspaceEdit,
} from 'vscode-languageserver-protocol';

export const ROOT = fileURLToPath(new URL('../..', import.meta.url));
export const BIN = join(ROOT, 'server/bin/rungs.js');

export function fileUri(path: string): string {
  return pathToFileURL(path).href;
}

/** Applies LSP text edits to a text (edits must not overlap, as LSP requires). */
export function applyTextEdits(text: string, edits: TextEdit[]): string {
  const starts = [0];
  for (let i = 0; i < text.length; i++) {
    if (text[i] === '\r' && text[i + 1] === '\n') continue;
    if (text[i] === '\n' || text[i] === '\r') starts.push(i + 1);
  }
  const offset = (p: { line: number; character: number }) =>
    p.line >= starts.length ? text.length : Math.min(starts[p.line] + p.character, text.length);
  // From the end backwards; at one start an insertion listed first lands before the replacement.
  const sorted = edits.map((e, i) => ({ e, i })).sort((a, b) => offset(b.e.range.start) - offset(a.e.range.start) || b.i - a.i).map((x) => x.e);
  let out = text;
  for (const e of sorted) out = out.slice(0, offset(e.range.start)) + e.newText + out.slice(offset(e.range.end));
  return out;
}

/** The edits a workspace edit makes to one document, whichever form it uses. */
export function editsFor(edit: WorkspaceEdit, uri: string): TextEdit[] {
  if (edit.changes?.[uri]) return edit.changes[uri];
  const out: TextEdit[] = [];
  for (const c of edit.documentChanges ?? []) {
    if ('textDocument' in c && c.textDocument.uri === uri) out.push(...(c.edits as TextEdit[]));
  }
  return out;
}

type Waiter = { test: () => boolean; resolve: () => void };

/** Prefix of the ids of requests sent with sendBatch (the connection numbers its own). */
const BATCH_ID = 'batch-';

export class LspTestClient {
  readonly connection: ProtocolConnection;
  readonly proc: ChildProcess;
  readonly diagnostics = new Map<string, PublishDiagnosticsParams>();
  readonly analyzed: { uri: string; version: number }[] = [];
  readonly logs: string[] = [];
  readonly appliedEdits: WorkspaceEdit[] = [];
  readonly texts = new Map<string, { version: number; text: string }>();
  stderr = '';
  /** Number of publishDiagnostics notifications received so far. */
  publishCount = 0;
  /** Capabilities the server registered and has not unregistered, by registration id. */
  readonly registrations = new Map<string, { method: string; registerOptions?: unknown }>();
  /** What the client answers to workspace/configuration (section "rungs"). */
  settings: Record<string, unknown> = {};
  capabilities!: InitializeResult['capabilities'];
  private waiters: Waiter[] = [];
  /** Responses to requests sent with sendBatch, by their (string) id. */
  private readonly rawResponses = new Map<string, { result?: unknown; error?: { code: number; message: string } }>();

  constructor(args: string[] = ['lsp', '--stdio']) {
    if (!existsSync(join(ROOT, 'dist/rungs.js'))) throw new Error('dist/rungs.js is missing: run `npm run build` first');
    this.proc = spawn(process.execPath, [BIN, ...args], { cwd: ROOT, stdio: ['pipe', 'pipe', 'pipe'] });
    this.proc.stderr!.on('data', (d) => (this.stderr += String(d)));
    this.connection = createProtocolConnection(new StreamMessageReader(this.proc.stdout!), new StreamMessageWriter(this.proc.stdin!));
    this.connection.onNotification('textDocument/publishDiagnostics', (p: PublishDiagnosticsParams) => {
      this.diagnostics.set(p.uri, p);
      this.publishCount++;
      this.wake();
    });
    this.connection.onNotification('rungs/didAnalyze', (p: { uri: string; version: number }) => {
      this.analyzed.push(p);
      this.wake();
    });
    this.connection.onNotification('window/logMessage', (p: { message: string }) => {
      this.logs.push(p.message);
      this.wake();
    });
    this.connection.onRequest('workspace/configuration', (p: { items: { section?: string }[] }) =>
      p.items.map((i) => (i.section === 'rungs' ? this.settings : null)),
    );
    type Registration = { id: string; method: string; registerOptions?: unknown };
    this.connection.onRequest('client/registerCapability', (p: { registrations: Registration[] }) => {
      for (const r of p.registrations) this.registrations.set(r.id, { method: r.method, registerOptions: r.registerOptions });
      this.wake();
      return null;
    });
    this.connection.onRequest('client/unregisterCapability', (p: { unregisterations: { id: string }[] }) => {
      for (const r of p.unregisterations) this.registrations.delete(r.id);
      this.wake();
      return null;
    });
    this.connection.onRequest('workspace/inlayHint/refresh', () => null);
    this.connection.onRequest('workspace/semanticTokens/refresh', () => null);
    this.connection.onRequest('workspace/codeLens/refresh', () => null);
    this.connection.onRequest('workspace/applyEdit', (p: { edit: WorkspaceEdit }) => {
      this.appliedEdits.push(p.edit);
      for (const [uri, doc] of this.texts) {
        const edits = editsFor(p.edit, uri);
        if (edits.length) doc.text = applyTextEdits(doc.text, edits);
      }
      this.wake();
      return { applied: true };
    });
    this.connection.listen();
    // A second reader on the server's output sees the responses to sendBatch's requests, which
    // the connection does not know (it drops responses to ids it did not send).
    new StreamMessageReader(this.proc.stdout!).listen((m) => {
      const r = m as { id?: unknown; result?: unknown; error?: { code: number; message: string } };
      if (typeof r.id === 'string' && r.id.startsWith(BATCH_ID) && ('result' in r || 'error' in r)) {
        this.rawResponses.set(r.id, r);
        this.wake();
      }
    });
  }

  /**
   * Writes JSON-RPC messages in a single write, so the server reads them together (the connection
   * writes each message on its own turn). Requests must use ids made by `batchId`.
   */
  sendBatch(messages: object[]): void {
    const frames = messages.map((m) => {
      const body = Buffer.from(JSON.stringify({ jsonrpc: '2.0', ...m }), 'utf8');
      return Buffer.concat([Buffer.from(`Content-Length: ${body.length}\r\n\r\n`, 'ascii'), body]);
    });
    this.proc.stdin!.write(Buffer.concat(frames));
  }

  private batchIds = 0;
  batchId(): string {
    return `${BATCH_ID}${++this.batchIds}`;
  }

  /** The answer to a request sent with sendBatch: its result, or a rejection with its error. */
  async responseTo(id: string): Promise<unknown> {
    await this.waitFor(() => this.rawResponses.has(id), `the response to ${id}`);
    const r = this.rawResponses.get(id)!;
    if (r.error) throw r.error;
    return r.result;
  }

  private wake(): void {
    for (const w of [...this.waiters]) {
      if (w.test()) {
        this.waiters.splice(this.waiters.indexOf(w), 1);
        w.resolve();
      }
    }
  }

  /** Resolves when `test` holds (checked now and after every message from the server). */
  waitFor(test: () => boolean, what: string, ms = 20_000): Promise<void> {
    if (test()) return Promise.resolve();
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`timed out waiting for ${what}; stderr: ${this.stderr}`)), ms);
      this.waiters.push({ test, resolve: () => (clearTimeout(timer), resolve()) });
    });
  }

  async initialize(rootPath = ROOT): Promise<InitializeResult> {
    const r: InitializeResult = await this.connection.sendRequest('initialize', {
      processId: process.pid,
      rootUri: fileUri(rootPath),
      workspaceFolders: [{ uri: fileUri(rootPath), name: 'root' }],
      capabilities: {
        workspace: {
          configuration: true,
          applyEdit: true,
          workspaceEdit: { documentChanges: true },
          didChangeConfiguration: { dynamicRegistration: true },
          didChangeWatchedFiles: { dynamicRegistration: true, relativePatternSupport: true },
          workspaceFolders: true,
          inlayHint: { refreshSupport: true },
          semanticTokens: { refreshSupport: true },
          codeLens: { refreshSupport: true },
        },
        textDocument: {
          synchronization: { dynamicRegistration: false },
          hover: { contentFormat: ['markdown', 'plaintext'] },
          publishDiagnostics: { relatedInformation: true, versionSupport: true, codeDescriptionSupport: true, tagSupport: { valueSet: [1, 2] } },
          codeAction: { codeActionLiteralSupport: { codeActionKind: { valueSet: ['quickfix', 'refactor', 'refactor.rewrite', 'source'] } } },
          inlayHint: {},
          semanticTokens: { requests: { full: true }, tokenTypes: [], tokenModifiers: [], formats: ['relative'] },
        },
      },
    });
    this.capabilities = r.capabilities;
    await this.connection.sendNotification('initialized', {});
    return r;
  }

  async open(uri: string, text: string, version = 1): Promise<void> {
    this.texts.set(uri, { version, text });
    await this.connection.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId: 'rungs', version, text } });
  }

  /** Sends incremental changes and keeps the client's copy of the text in step. */
  async change(uri: string, changes: { range: TextEdit['range']; text: string }[]): Promise<number> {
    const doc = this.texts.get(uri)!;
    doc.version++;
    for (const c of changes) doc.text = applyTextEdits(doc.text, [{ range: c.range, newText: c.text }]);
    const contentChanges: TextDocumentContentChangeEvent[] = changes;
    await this.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version: doc.version }, contentChanges });
    return doc.version;
  }

  /** Diagnostics published for exactly this version of the document. */
  async diagnosticsFor(uri: string, version: number): Promise<Diagnostic[]> {
    await this.waitFor(() => this.diagnostics.get(uri)?.version === version, `diagnostics of ${uri} v${version}`);
    return this.diagnostics.get(uri)!.diagnostics;
  }

  request<R>(method: string, params: unknown): Promise<R> {
    return this.connection.sendRequest(method, params) as Promise<R>;
  }

  async close(): Promise<void> {
    try {
      await Promise.race([this.connection.sendRequest('shutdown'), new Promise((r) => setTimeout(r, 2000))]);
      await this.connection.sendNotification('exit');
    } catch {
      // The server may already be gone; the process is killed below either way.
    }
    await new Promise<void>((resolve) => {
      if (this.proc.exitCode !== null) return resolve();
      const t = setTimeout(() => (this.proc.kill(), resolve()), 3000);
      this.proc.on('exit', () => (clearTimeout(t), resolve()));
    });
    this.connection.dispose();
  }
}
