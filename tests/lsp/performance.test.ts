// Over the protocol: a 10,000-item script opened in the server, one character typed, then a
// hover. The hover must answer for the new text (never a stale analysis). Times are printed for
// people; speed targets belong to `npm run bench`, so nothing here asserts a time.
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, expect, it } from 'vitest';
import type { Hover } from 'vscode-languageserver-protocol';
import { fileUri, LspTestClient } from '../helpers/lspClient';
import { benchScript } from './bigScript';

let c: LspTestClient | undefined;
afterAll(async () => c?.close());

it('a 10,000-item script stays responsive: edit then hover', async () => {
  c = new LspTestClient();
  await c.initialize();
  const uri = fileUri(join(mkdtempSync(join(tmpdir(), 'rungs-perf-')), 'big.rungs'));
  const text = await benchScript(10_000);
  let t = performance.now();
  await c.open(uri, text);
  await c.diagnosticsFor(uri, 1);
  const openMs = performance.now() - t;
  const lines = text.split('\n');
  const line = lines.findIndex((l) => /^\w/.test(l) && l.endsWith('.') && !l.includes('|'));
  const hoverMs: number[] = [];
  for (let i = 0; i < 5; i++) {
    t = performance.now();
    await c.change(uri, [{ range: { start: { line, character: 2 }, end: { line, character: 2 } }, text: '!' }]);
    // Hover on the last word of the edited line (before its full stop): its range is where
    // the new text puts it, so the answer was computed on the edited version.
    const end = lines[line].length + i + 1;
    const h = await c.request<Hover>('textDocument/hover', { textDocument: { uri }, position: { line, character: end - 2 } });
    hoverMs.push(performance.now() - t);
    expect(h.range!.end.character).toBe(end - 1);
  }
  t = performance.now();
  await c.request('textDocument/hover', { textDocument: { uri }, position: { line, character: 10 } });
  const cachedMs = performance.now() - t;
  const median = [...hoverMs].sort((a, b) => a - b)[2];
  console.log(
    `10,000 items over LSP: open to first diagnostics ${openMs.toFixed(0)} ms; one-character edit then hover ` +
      `${median.toFixed(0)} ms (median of 5, includes re-analysis and lint); hover on an unchanged version ${cachedMs.toFixed(1)} ms`,
  );
});
