// The expectations of the real-workbench test, asked of the language server itself over plain
// LSP (stdio, no editor): the ladder, the problems and the numbers the workbench must then show.
// The workbench test checks that the editor shows what the server computed, and separately that
// the planted problems of the demo script are among them.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import {
  createProtocolConnection,
  InitializeRequest,
  InitializedNotification,
  DidOpenTextDocumentNotification,
  PublishDiagnosticsNotification,
  RequestType,
  StreamMessageReader,
  StreamMessageWriter,
  type Diagnostic,
} from 'vscode-languageserver-protocol/node';
import type { Ladder } from '../../client/src/protocol';

const LadderRequest = new RequestType<{ uri: string }, Ladder | null, void>('rungs/ladder');

export interface Oracle {
  ladder: Ladder;
  diagnostics: Diagnostic[];
}

/** Opens `file` in `node <server> --stdio` and returns its ladder and published diagnostics. */
export async function askServer(server: string, file: string, timeoutMs = 30_000): Promise<Oracle> {
  const child = spawn(process.execPath, [server, '--stdio'], { stdio: ['pipe', 'pipe', 'inherit'] });
  const conn = createProtocolConnection(new StreamMessageReader(child.stdout), new StreamMessageWriter(child.stdin));
  const uri = pathToFileURL(file).href;
  const timer = setTimeout(() => child.kill(), timeoutMs);
  try {
    const diagnostics = new Promise<Diagnostic[]>((resolve) => {
      conn.onNotification(PublishDiagnosticsNotification.type, (p) => {
        if (p.uri === uri) resolve(p.diagnostics);
      });
    });
    conn.onRequest('workspace/configuration', (p: { items: unknown[] }) => p.items.map(() => null));
    conn.listen();
    await conn.sendRequest(InitializeRequest.type, {
      processId: process.pid,
      rootUri: null,
      capabilities: { workspace: { configuration: true } },
      workspaceFolders: null,
    });
    await conn.sendNotification(InitializedNotification.type, {});
    await conn.sendNotification(DidOpenTextDocumentNotification.type, {
      textDocument: { uri, languageId: 'rungs', version: 1, text: readFileSync(file, 'utf8') },
    });
    const diags = await diagnostics;
    const ladder = await conn.sendRequest(LadderRequest, { uri });
    if (!ladder) throw new Error(`the server returned no ladder for ${file}`);
    return { ladder, diagnostics: diags };
  } finally {
    clearTimeout(timer);
    conn.dispose();
    child.kill();
  }
}
