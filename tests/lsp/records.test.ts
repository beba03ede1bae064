// Rate records over the protocol: diagnostics on a records file (rule, line, column), a hover on a
// row with its rate, ratio, unassisted rate and the mark, a trend lens, the progress view's
// payload, the latest ratio in a script's rung hover, and scripts read from open documents first.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CodeLens, Hover, TextEdit } from 'vscode-languageserver-protocol';
import type { ProgressView } from '../../server/src/lsp/contract';
import { fileUri, LspTestClient } from '../helpers/lspClient';

const root = mkdtempSync(join(tmpdir(), 'rungs-records-'));
const SCRIPT = '@paces 1, 1.5 wps\n== Short\nHi there.\nSee you soon.\n== Long\nThank you for coming today.\n';
writeFileSync(join(root, 'a.rungs'), SCRIPT);
const RECORDS = [
  'date,client,script,rung,condition,words,seconds',
  '2026-03-02,C-0417,,,unassisted,10,10',
  '2026-03-02,C-0417,a.rungs,Short,paced,12,10',
  '2026-03-09,C-0417,a.rungs,Short,paced,14,10',
  '2026-03-09,C-0417,a.rungs,Short,paced,14,0',
  '',
].join('\n');
const recordsPath = join(root, 'clinic.rates.csv');
writeFileSync(recordsPath, RECORDS);
const recordsUri = fileUri(recordsPath);
// A second records file that stays closed: the rung hover reads it from disk once, and again only
// after a watched-file event for it.
const otherPath = join(root, 'other.rates.csv');
const otherRows = (seconds: number) =>
  ['date,client,script,rung,condition,words,seconds', '2026-03-10,C-0999,,,unassisted,10,10', `2026-03-10,C-0999,a.rungs,Short,paced,15,${seconds}`, ''].join('\n');
writeFileSync(otherPath, otherRows(10));
const scriptUri = fileUri(join(root, 'a.rungs'));

let c: LspTestClient;
const hoverText = async (uri: string, line: number, character = 0): Promise<string> => {
  const h = await c.request<Hover | null>('textDocument/hover', { textDocument: { uri }, position: { line, character } });
  return h && typeof h.contents === 'object' && 'value' in h.contents ? h.contents.value : '';
};

beforeAll(async () => {
  c = new LspTestClient();
  await c.initialize(root);
  await c.open(recordsUri, RECORDS);
});
afterAll(async () => {
  await c?.close();
});

describe('a records file in the language server', () => {
  it('publishes each bad row on its cell', async () => {
    const d = await c.diagnosticsFor(recordsUri, 1);
    // computed: line 5 (0-based 4), seconds cell after "2026-03-09,C-0417,a.rungs,Short,paced,14," = 41 characters.
    expect(d.map((x) => [x.code, x.range.start.line, x.range.start.character, x.message])).toEqual([
      ['bad-record', 4, 41, 'seconds must be above 0, not 0'],
    ]);
  });

  it('hovers a paced row with its rate, ratio, the unassisted rate it was compared with and the mark', async () => {
    const t = await hoverText(recordsUri, 2, 5);
    // computed: 12 / 10 = 1.2 words/s; 10 / 10 = 1.0 unassisted; ratio 1.2 meets 1.2.
    expect(t).toContain('12 words in 10 s = **1.2 words/s**');
    expect(t).toContain('Ratio **1.2** to 1 words/s unassisted (same day, line 2): meets the mark of 1.2');
    expect(t).toContain("Model pace 1 wps (the rung's first pace): kept 120%");
    expect(await hoverText(recordsUri, 3)).toContain('(2026-03-02, line 2)');
    expect(await hoverText(recordsUri, 0)).toBe('');
  });

  it('shows the trend in a code lens and serves the progress view', async () => {
    const lenses = await c.request<CodeLens[]>('textDocument/codeLens', { textDocument: { uri: recordsUri } });
    expect(lenses.map((l) => [l.range.start.line, l.command?.title])).toEqual([
      [3, 'C-0417 · Short: ratios 1.2, 1.4 · +0.2/week · meets the mark in the last 2 sessions; consider the next rung'],
    ]);
    const v = await c.request<ProgressView | null>('rungs/progress', { uri: recordsUri });
    expect(v).toMatchObject({ benefitMark: 1.2, rows: 4, recordsRead: 3, problems: 1 });
    expect(v!.trends[0].points.map((p) => [p.date, p.day, p.benefit])).toEqual([['2026-03-02', 0, true], ['2026-03-09', 7, true]]);
    expect(await c.request<TextEdit[]>('textDocument/formatting', { textDocument: { uri: recordsUri }, options: { tabSize: 2, insertSpaces: true } })).toEqual([]);
  });

  it("adds the latest ratio per client to a script's rung hover", async () => {
    await c.open(scriptUri, SCRIPT);
    await c.diagnosticsFor(scriptUri, 1);
    const t = await hoverText(scriptUri, 1, 4);
    expect(t).toContain('**Latest paced/unassisted ratio** (rate records):');
    expect(t).toContain('- C-0417 · 2026-03-09: 1.4 (meets 1.2)');
    expect(await hoverText(scriptUri, 4, 4)).not.toContain('Latest paced/unassisted ratio');
  });

  it("answers a rung hover from memory, and reads a records file on disk again after a watched-file event", async () => {
    // computed: 15 words / 10 s = 1.5 words/s paced over 10 / 10 = 1.0 unassisted: ratio 1.5.
    expect(await hoverText(scriptUri, 1, 4)).toContain('- C-0999 · 2026-03-10: 1.5 (meets 1.2)');
    // computed: 15 words / 12.5 s = 1.2 words/s over 1.0: ratio 1.2.
    writeFileSync(otherPath, otherRows(12.5));
    // No event yet: the hover answers from what it read before, so it has not read the file again.
    expect(await hoverText(scriptUri, 1, 4)).toContain('- C-0999 · 2026-03-10: 1.5 (meets 1.2)');
    await c.connection.sendNotification('workspace/didChangeWatchedFiles', { changes: [{ uri: fileUri(otherPath), type: 2 }] });
    const t = await hoverText(scriptUri, 1, 4);
    expect(t).toContain('- C-0999 · 2026-03-10: 1.2 (meets 1.2)');
    expect(t).toContain('- C-0417 · 2026-03-09: 1.4 (meets 1.2)');
  });

  it('reads a script from its open document: renaming a rung there is seen in the records', async () => {
    const v = await c.change(scriptUri, [{ range: { start: { line: 1, character: 3 }, end: { line: 1, character: 8 } }, text: 'Brief' }]);
    await c.diagnosticsFor(scriptUri, v);
    await c.waitFor(() => (c.diagnostics.get(recordsUri)?.diagnostics.length ?? 0) === 4, 'records re-checked against the edited script');
    const d = c.diagnostics.get(recordsUri)!.diagnostics;
    expect(d.filter((x) => String(x.message).startsWith('"a.rungs" has no rung "Short"')).map((x) => x.range.start.line)).toEqual([2, 3, 4]);
  });
});
