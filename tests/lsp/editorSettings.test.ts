// Editor settings of the matched-set, rate-record and timing blocks reach the language server's
// results: the benefit mark set in the editor (rungs.records.benefitMark) changes a records
// hover and trend lens, and a config file beside a records file still wins over it.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CodeLens, Hover } from 'vscode-languageserver-protocol';
import { fileUri, LspTestClient } from '../helpers/lspClient';

const root = mkdtempSync(join(tmpdir(), 'rungs-editor-settings-'));
const SCRIPT = '@paces 1 wps\n== Short\nHi there.\nSee you soon.\n';
// computed: 10 words / 10 s = 1.0 words/s unassisted; 12 / 10 = 1.2 paced; ratio 1.2.
const RECORDS = ['date,client,script,rung,condition,words,seconds', '2026-03-02,C-0417,,,unassisted,10,10', '2026-03-02,C-0417,a.rungs,Short,paced,12,10', ''].join('\n');
writeFileSync(join(root, 'a.rungs'), SCRIPT);
const recordsPath = join(root, 'clinic.rates.csv');
writeFileSync(recordsPath, RECORDS);
mkdirSync(join(root, 'team'));
writeFileSync(join(root, 'team', 'a.rungs'), SCRIPT);
writeFileSync(join(root, 'team', '.rungs.json'), JSON.stringify({ 'benefit-mark': 1.1 }));
const teamPath = join(root, 'team', 'team.rates.csv');
writeFileSync(teamPath, RECORDS);
const uri = fileUri(recordsPath);
const teamUri = fileUri(teamPath);

let c: LspTestClient;
const hoverText = async (u: string, line: number): Promise<string> => {
  const h = await c.request<Hover | null>('textDocument/hover', { textDocument: { uri: u }, position: { line, character: 0 } });
  return h && typeof h.contents === 'object' && 'value' in h.contents ? h.contents.value : '';
};
const lensTitles = async (u: string) => (await c.request<CodeLens[]>('textDocument/codeLens', { textDocument: { uri: u } })).map((l) => l.command?.title);

beforeAll(async () => {
  c = new LspTestClient();
  await c.initialize(root);
  await c.open(uri, RECORDS);
  await c.open(teamUri, RECORDS);
  await c.diagnosticsFor(uri, 1);
  await c.diagnosticsFor(teamUri, 1);
});
afterAll(async () => {
  await c?.close();
});

describe('editor settings in the language server', () => {
  it('rungs.records.benefitMark changes the mark a records row is judged by; a config file still wins', async () => {
    // Default mark 1.2 (common practice): a ratio of exactly 1.2 meets it.
    expect(await hoverText(uri, 2)).toContain('Ratio **1.2** to 1 words/s unassisted (same day, line 2): meets the mark of 1.2');
    c.settings = { records: { benefitMark: 1.3 } };
    const before = c.publishCount;
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.waitFor(() => c.publishCount >= before + 2, 'records republished with the new settings');
    expect(await hoverText(uri, 2)).toContain('Ratio **1.2** to 1 words/s unassisted (same day, line 2): below the mark of 1.3');
    expect((await lensTitles(uri))[0]).toContain('at or above the mark (1.3) in 0 of 1 session');
    // The team folder's .rungs.json (benefit-mark 1.1) is a config file: it wins over the editor.
    expect(await hoverText(teamUri, 2)).toContain('meets the mark of 1.1');
  });

  it('an unreadable editor value falls back to the default', async () => {
    c.settings = { records: { benefitMark: 'lots' } };
    const before = c.publishCount;
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.waitFor(() => c.publishCount >= before + 2, 'records republished with the new settings');
    expect(await hoverText(uri, 2)).toContain('meets the mark of 1.2');
  });
});
