// A JSON-RPC storm against the real server process, bounded (3,000 edits) so it runs in CI: random
// valid and out-of-range edits, interleaved requests, cancellations, reused (stale) version
// numbers, close and reopen. At the end the server is alive and its diagnostics equal those of a
// fresh server given the final text. The server's resident memory is printed for the record.
// Also the protocol regressions of the hardening issue, one by one.
import { readFileSync } from 'node:fs';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { TextEdit } from 'vscode-languageserver-protocol';
import { applyTextEdits, fileUri, LspTestClient, ROOT } from '../helpers/lspClient';

const dir = mkdtempSync(join(tmpdir(), 'rungs-storm-'));
const START = readFileSync(join(ROOT, 'sample-scripts', 'family-visits-draft.rungs'), 'utf8');
const SNIPPETS = ['Hi.', 'Come in.', '== New rung @pace 2 wps', '@paces 1, 2 wps', '\n', '\r\n', '| @set a #x', 'granddaughter ', '@weights 1 1 1\n', '== \u2028 @pace 1\n', ' '.repeat(200), '@say okafor = OW0 K AA1 F AO0 R\n', ''];

function rng(seed: number) {
  return () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
}

/**
 * The document after a change as the protocol means it once clamped: a position past the last
 * line is the end of the text, a character past a line's end is that line's end (before its
 * break), negative numbers are 0. Written independently of the server's clamping.
 */
function applyClamped(text: string, range: TextEdit['range'], newText: string): string {
  const lines: { start: number; end: number }[] = [];
  const re = /\r\n|\r|\n/g;
  let at = 0;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    lines.push({ start: at, end: m.index });
    at = m.index + m[0].length;
  }
  lines.push({ start: at, end: text.length });
  const off = (p: { line: number; character: number }) => {
    const l = Math.max(0, p.line);
    if (l >= lines.length) return text.length;
    return Math.min(lines[l].start + Math.max(0, p.character), lines[l].end);
  };
  let [s, e] = [off(range.start), off(range.end)];
  if (s > e) [s, e] = [e, s];
  return text.slice(0, s) + newText + text.slice(e);
}

function rssOf(pid: number | undefined): string {
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? `${(Number(m[1]) / 1024).toFixed(1)} MiB` : 'unknown';
  } catch {
    return 'unknown (no /proc)';
  }
}

const clients: LspTestClient[] = [];
afterAll(async () => {
  for (const c of clients) await c.close();
});

async function server(): Promise<LspTestClient> {
  const c = new LspTestClient();
  clients.push(c);
  await c.initialize(dir);
  return c;
}

describe('protocol edge cases', () => {
  it('a change far past the end of the document is clamped, and the server lives on', async () => {
    const c = await server();
    const uri = fileUri(join(dir, 'far.rungs'));
    await c.open(uri, 'Hi.\n');
    // A range of one line far past the end, replaced by one line: unclamped, the text document
    // library records a line offset at index 2^31, and the next edit above it walks every index.
    const huge = 2 ** 31 - 2;
    await c.connection.sendNotification('textDocument/didChange', {
      textDocument: { uri, version: 2 },
      contentChanges: [{ range: { start: { line: huge, character: huge }, end: { line: huge + 1, character: 0 } }, text: 'Come in.\n' }],
    });
    await c.connection.sendNotification('textDocument/didChange', {
      textDocument: { uri, version: 3 },
      contentChanges: [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, text: 'Hello. ' }],
    });
    await c.diagnosticsFor(uri, 3);
    const lines = await c.request<{ range: { end: { line: number } } }[]>('textDocument/foldingRange', { textDocument: { uri } });
    expect(lines).toBeDefined();
    const f = await c.request<TextEdit[]>('textDocument/formatting', { textDocument: { uri }, options: { tabSize: 2, insertSpaces: true } });
    expect(f).toEqual([]);
    const sym = await c.request<{ name: string }[]>('textDocument/documentSymbol', { textDocument: { uri } });
    expect(JSON.stringify(sym)).toContain('Items');
    expect(c.proc.exitCode).toBeNull();
  });

  it('a change that reuses an older version number is analysed, not answered from the old snapshot', async () => {
    const c = await server();
    const uri = fileUri(join(dir, 'stale.rungs'));
    await c.open(uri, '@pacse 1\nHi.\n', 1);
    await c.diagnosticsFor(uri, 1);
    await c.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version: 2 }, contentChanges: [{ text: '@pacse 2\nHi.\n' }] });
    expect((await c.diagnosticsFor(uri, 2)).map((d) => d.code)).toContain('unknown-key');
    // Version 2 again, with other text: the answers must be about this text, not the one before.
    await c.connection.sendNotification('textDocument/didChange', { textDocument: { uri, version: 2 }, contentChanges: [{ text: '== Other\nHi.\n' }] });
    const sym = await c.request<{ name: string }[]>('textDocument/documentSymbol', { textDocument: { uri } });
    expect(sym.map((x) => x.name)).toEqual(['Other']);
    await c.waitFor(() => c.diagnostics.get(uri)?.version === 2 && !c.diagnostics.get(uri)!.diagnostics.some((d) => d.code === 'unknown-key'), 'diagnostics of the new text under the reused version');
  });

  it('formats a rung header holding U+2028', async () => {
    const c = await server();
    const uri = fileUri(join(dir, 'sep.rungs'));
    await c.open(uri, '==  A\u2028B   @pace  1 ==\nHi.\n');
    const edits = await c.request<TextEdit[]>('textDocument/formatting', { textDocument: { uri }, options: { tabSize: 2, insertSpaces: true } });
    expect(applyTextEdits('==  A\u2028B   @pace  1 ==\nHi.\n', edits)).toBe('== A\u2028B @pace 1 ==\nHi.\n');
  });
});

describe('storm', () => {
  it('3,000 random edits with requests, cancellations, stale versions and reopening', async () => {
    const c = await server();
    const uri = fileUri(join(dir, 'storm.rungs'));
    const rand = rng(20_261_202);
    const pick = <T,>(xs: T[]) => xs[Math.floor(rand() * xs.length)];
    let text = START;
    let version = 1;
    let top = 1;
    await c.open(uri, text, version);
    const pos = () => {
      const lines = text.split(/\r\n|\r|\n/);
      const r = rand();
      if (r < 0.08) return { line: pick([2 ** 31 - 1, 1e9, lines.length + 5, -3]), character: pick([0, 2 ** 31 - 1, -7, 5]) };
      const line = Math.floor(rand() * lines.length);
      return { line, character: Math.floor(rand() * (lines[line].length + (r < 0.12 ? 50 : 1))) };
    };
    const requests = ['textDocument/hover', 'textDocument/documentSymbol', 'textDocument/formatting', 'textDocument/codeAction', 'textDocument/semanticTokens/full', 'textDocument/inlayHint', 'textDocument/completion', 'rungs/ladder'];
    let batch: object[] = [];
    const ids: string[] = [];
    for (let step = 0; step < 3000; step++) {
      const r = rand();
      if (r < 0.02) {
        // Close and reopen with the same text and a new version.
        batch.push({ method: 'textDocument/didClose', params: { textDocument: { uri } } });
        version = ++top;
        batch.push({ method: 'textDocument/didOpen', params: { textDocument: { uri, languageId: 'rungs', version, text } } });
      } else if (r < 0.12) {
        const id = c.batchId();
        const p = pos();
        const method = pick(requests);
        batch.push({ id, method, params: { textDocument: { uri }, uri, position: p, range: { start: p, end: p }, context: { diagnostics: [] }, options: { tabSize: 2, insertSpaces: true } } });
        if (rand() < 0.5) batch.push({ method: '$/cancelRequest', params: { id } });
        ids.push(id);
      } else {
        const a = pos();
        // Mostly insertions and short replacements, so the text keeps growing and changing.
        const b = rand() < 0.7 ? a : rand() < 0.9 ? { line: a.line + (rand() < 0.2 ? 1 : 0), character: a.character + Math.floor(rand() * 12) } : pos();
        const insert = pick(SNIPPETS);
        // Mostly increasing versions; now and then an older number is reused.
        version = rand() < 0.05 && top > 3 ? top - 2 : ++top;
        text = applyClamped(text, { start: a, end: b }, insert);
        batch.push({ method: 'textDocument/didChange', params: { textDocument: { uri, version }, contentChanges: [{ range: { start: a, end: b }, text: insert }] } });
      }
      if (batch.length >= 50) {
        c.sendBatch(batch);
        batch = [];
      }
    }
    // The final version is new, so the diagnostics waited for are those of the final text.
    version = ++top;
    batch.push({ method: 'textDocument/didChange', params: { textDocument: { uri, version }, contentChanges: [{ range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } }, text: '' }] } });
    c.sendBatch(batch);
    for (const id of ids) await c.responseTo(id).catch(() => null);
    const stormed = await c.diagnosticsFor(uri, version);
    expect(c.proc.exitCode).toBeNull();
    console.log(`storm: server RSS after 3,000 edits and ${ids.length} requests: ${rssOf(c.proc.pid)}; final text ${text.length} characters`);

    const fresh = await server();
    const u2 = fileUri(join(dir, 'storm.rungs'));
    await fresh.open(u2, text, 1);
    const expected = await fresh.diagnosticsFor(u2, 1);
    expect(stormed.length).toBeGreaterThan(0);
    expect(stormed).toEqual(expected);
  }, 120_000);
});
