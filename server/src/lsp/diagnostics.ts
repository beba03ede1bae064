// Publishing a script's problems costs what changed, not what the script holds. The rules hand on
// the same problem object while what it says holds (a rung an edit did not touch keeps its
// problems), so each problem is converted to a diagnostic once, and each diagnostic is written as
// JSON once: a publish of 800 diagnostics after a keystroke joins strings it already has instead
// of converting and serialising all of them again. Beyond that, the last publish is kept: the
// problems an edit left alone stand at the start and the end of the new list, in the same order,
// so their diagnostics and bytes are taken from the last publish in two pieces and only the
// problems between are looked up one by one.
import type { Diagnostic } from 'vscode-languageserver/node';
import type { Message } from 'vscode-languageserver/node';
import type { Problem } from '../core/types';
import { toLspDiagnostic } from './convert';

/** Diagnostics by problem; the URI is part of one (related places point into the document). */
const converted = new WeakMap<Problem, { uri: string; diagnostic: Diagnostic }>();

/** How many leading and trailing entries of two lists are the same objects (not overlapping). */
export function sameEnds<T>(a: readonly T[], b: readonly T[]): [head: number, tail: number] {
  const most = Math.min(a.length, b.length);
  let head = 0;
  while (head < most && a[head] === b[head]) head++;
  let tail = 0;
  while (tail < most - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) tail++;
  return [head, tail];
}

/** The last list converted, with its diagnostics (one script is edited at a time). */
let lastConverted: { uri: string; problems: readonly Problem[]; diagnostics: Diagnostic[] } | undefined;

function convertOne(p: Problem, uri: string): Diagnostic {
  const hit = converted.get(p);
  if (hit && hit.uri === uri) return hit.diagnostic;
  const diagnostic = toLspDiagnostic(p, uri);
  converted.set(p, { uri, diagnostic });
  return diagnostic;
}

/** A script's problems as LSP diagnostics, each converted once per problem object and URI. */
export function diagnosticsOf(problems: readonly Problem[], uri: string): Diagnostic[] {
  const out: Diagnostic[] = new Array(problems.length);
  const last = lastConverted?.uri === uri ? lastConverted : undefined;
  const [head, tail] = last ? sameEnds(last.problems, problems) : [0, 0];
  for (let i = 0; i < head; i++) out[i] = last!.diagnostics[i];
  for (let i = 0; i < tail; i++) out[problems.length - 1 - i] = last!.diagnostics[last!.diagnostics.length - 1 - i];
  for (let i = head; i < problems.length - tail; i++) out[i] = convertOne(problems[i], uri);
  lastConverted = { uri, problems, diagnostics: out };
  return out;
}

/** Each diagnostic's JSON in UTF-8, kept while the diagnostic object lives (diagnostics are never changed once sent). */
const written = new WeakMap<Diagnostic, Buffer>();

const PUBLISH = 'textDocument/publishDiagnostics';
const COMMA = Buffer.from(',');
const CLOSE = Buffer.from(']}}');

/**
 * The last list of diagnostics written: its bytes (each diagnostic's JSON, comma-separated) and
 * where each diagnostic starts in them.
 */
let lastWritten: { diagnostics: readonly Diagnostic[]; body: Buffer; starts: Int32Array } | undefined;

function diagnosticBytes(d: Diagnostic): Buffer {
  let bytes = written.get(d);
  if (bytes === undefined) written.set(d, (bytes = Buffer.from(JSON.stringify(d), 'utf-8')));
  return bytes;
}

/** A list of diagnostics as comma-separated JSON, taking the pieces it shares with the last list from it. */
function listBytes(diagnostics: readonly Diagnostic[]): Buffer {
  const n = diagnostics.length;
  const last = lastWritten;
  const [head, tail] = last ? sameEnds(last.diagnostics, diagnostics) : [0, 0];
  const parts: Buffer[] = [];
  const starts = new Int32Array(n);
  let length = 0;
  const add = (b: Buffer): number => {
    if (parts.length) {
      parts.push(COMMA);
      length++;
    }
    parts.push(b);
    const at = length;
    length += b.length;
    return at;
  };
  if (head) {
    // The last list's first `head` diagnostics, without the comma after them.
    const end = head < last!.diagnostics.length ? last!.starts[head] - 1 : last!.body.length;
    add(last!.body.subarray(0, end));
    starts.set(last!.starts.subarray(0, head));
  }
  for (let i = head; i < n - tail; i++) starts[i] = add(diagnosticBytes(diagnostics[i]));
  if (tail) {
    const from = last!.starts[last!.diagnostics.length - tail];
    const at = add(last!.body.subarray(from));
    for (let i = 0; i < tail; i++) starts[n - tail + i] = at + last!.starts[last!.diagnostics.length - tail + i] - from;
  }
  const body = Buffer.concat(parts, length);
  lastWritten = { diagnostics, body, starts };
  return body;
}

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
  return Buffer.concat([Buffer.from(`${head.slice(0, -2)},"diagnostics":[`, 'utf-8'), listBytes(diagnostics), CLOSE]);
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
