// Publishing a script's problems costs what changed, not what the script holds. The rules hand on
// the same problem object while what it says holds (a rung an edit did not touch keeps its
// problems), so each problem is converted to a diagnostic once, and each diagnostic is written as
// JSON once: a publish of 800 diagnostics after a keystroke joins strings it already has instead
// of converting and serialising all of them again.
import type { Diagnostic } from 'vscode-languageserver/node';
import type { Message } from 'vscode-languageserver/node';
import type { Problem } from '../core/types';
import { toLspDiagnostic } from './convert';

/** Diagnostics by problem; the URI is part of one (related places point into the document). */
const converted = new WeakMap<Problem, { uri: string; diagnostic: Diagnostic }>();

/** A script's problems as LSP diagnostics, each converted once per problem object and URI. */
export function diagnosticsOf(problems: readonly Problem[], uri: string): Diagnostic[] {
  const out: Diagnostic[] = new Array(problems.length);
  for (let i = 0; i < problems.length; i++) {
    const p = problems[i];
    const hit = converted.get(p);
    if (hit && hit.uri === uri) out[i] = hit.diagnostic;
    else {
      const diagnostic = toLspDiagnostic(p, uri);
      converted.set(p, { uri, diagnostic });
      out[i] = diagnostic;
    }
  }
  return out;
}

/** Each diagnostic's JSON in UTF-8, kept while the diagnostic object lives (diagnostics are never changed once sent). */
const written = new WeakMap<Diagnostic, Buffer>();

const PUBLISH = 'textDocument/publishDiagnostics';
const COMMA = Buffer.from(',');

/**
 * A message as UTF-8 JSON, as the protocol library writes it (JSON.stringify), with a published
 * list of diagnostics joined from each diagnostic's bytes. Any other message is stringified whole.
 */
export function messageBytes(msg: Message): Buffer {
  const m = msg as Message & { method?: string; params?: { diagnostics?: Diagnostic[] } };
  const params = m.method === PUBLISH ? m.params : undefined;
  if (!params || !Array.isArray(params.diagnostics)) return Buffer.from(JSON.stringify(msg), 'utf-8');
  const { diagnostics, ...rest } = params;
  if (!Object.keys(rest).length) return Buffer.from(JSON.stringify(msg), 'utf-8');
  // The head ends in `}}` (params last, and params has its URI): the list goes in before them.
  const head = JSON.stringify({ jsonrpc: m.jsonrpc, method: m.method, params: rest });
  const parts: Buffer[] = [Buffer.from(`${head.slice(0, -2)},"diagnostics":[`, 'utf-8')];
  for (let i = 0; i < diagnostics.length; i++) {
    const d = diagnostics[i];
    let bytes = written.get(d);
    if (bytes === undefined) written.set(d, (bytes = Buffer.from(JSON.stringify(d), 'utf-8')));
    if (i) parts.push(COMMA);
    parts.push(bytes);
  }
  parts.push(Buffer.from(']}}'));
  return Buffer.concat(parts);
}

/** The message writer's encoder (application/json in UTF-8, as the library's own) with publishes written as above. */
export const messageEncoder = {
  name: 'application/json',
  encode(msg: Message, options: { charset: BufferEncoding }): Promise<Uint8Array> {
    try {
      return Promise.resolve(options.charset === 'utf-8' || options.charset === 'utf8' ? messageBytes(msg) : Buffer.from(JSON.stringify(msg), options.charset));
    } catch (err) {
      return Promise.reject(err);
    }
  },
};
