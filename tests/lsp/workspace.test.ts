// Protocol tests of what lies outside the open scripts: config and lexicon files (their problems
// as diagnostics on their own URIs, watching them by resolved path) and workspace folders. Folder
// names hold spaces and non-ASCII letters, which must survive URI to path and back.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Hover } from 'vscode-languageserver-protocol';
import { words } from '../helpers/data';
import { fileUri, LspTestClient } from '../helpers/lspClient';

const root = mkdtempSync(join(tmpdir(), 'rungs-ws-'));
const folderA = join(root, 'Logopädie Ü');
const folderB = join(root, 'zweite Mappe ñ');
mkdirSync(folderA);
mkdirSync(folderB);

// Folder A: a config file naming a lexicon that is not called "*lexicon*" or "*.lex".
const configPath = join(folderA, '.rungs.json');
const CONFIG_BAD = '{\n  "lexicon": ["names.txt"],\n  "pacse": "1 wps"\n}\n';
const CONFIG_GOOD = '{\n  "lexicon": ["names.txt"]\n}\n';
writeFileSync(configPath, CONFIG_BAD);
const namesPath = join(folderA, 'names.txt');
writeFileSync(namesPath, '// Names the dictionary does not list.\n');
const scriptA = fileUri(join(folderA, 'names.rungs'));
const TEXT_A = '== Names\nTeodric plays the clarinet.\n';

// Folder B: not a workspace folder at first; its lexicon comes from the rungs.lexiconFiles setting,
// which is relative to the workspace folder holding the script.
writeFileSync(join(folderB, 'extra.txt'), 'Zorblat = Z AO1 R B L AE0 T\n');
const scriptB = fileUri(join(folderB, 'other.rungs'));
const TEXT_B = '== Other\nZorblat is here.\n';

let c: LspTestClient;

const hoverText = async (uri: string, line: number, character: number): Promise<string> => {
  const h = await c.request<Hover | null>('textDocument/hover', { textDocument: { uri }, position: { line, character } });
  return h && typeof h.contents === 'object' && 'value' in h.contents ? h.contents.value : '';
};
/** Resolves after the server analysed `uri` again (any `rungs/didAnalyze` after `since`). */
const reanalysed = (uri: string, since: number) =>
  c.waitFor(() => c.analyzed.slice(since).some((a) => a.uri === uri), `re-analysis of ${uri}`);

/**
 * Opens a script and waits for both of its first analyses: at once with default settings, then
 * with the client's settings once the server has asked for them (they differ here).
 */
async function openSettled(uri: string, text: string): Promise<void> {
  const since = c.analyzed.length;
  await c.open(uri, text);
  await c.waitFor(() => c.analyzed.slice(since).filter((a) => a.uri === uri).length >= 2, `both analyses of ${uri}`);
}

beforeAll(async () => {
  expect(words.pronunciations('teodric')).toBeUndefined();
  expect(words.pronunciations('zorblat')).toBeUndefined();
  c = new LspTestClient();
  c.settings = { lexiconFiles: ['extra.txt'] };
  await c.initialize(folderA);
  await openSettled(scriptA, TEXT_A);
});
afterAll(async () => {
  await c?.close();
});

describe('config file problems', () => {
  it('are published on the config file, with rule code and range, and cleared when fixed', async () => {
    const configUri = fileUri(configPath);
    await c.waitFor(() => (c.diagnostics.get(configUri)?.diagnostics.length ?? 0) > 0, 'diagnostics of .rungs.json');
    const d = c.diagnostics.get(configUri)!.diagnostics;
    expect(d.map((x) => [x.code, x.range.start.line, x.source])).toEqual([['unknown-key', 2, 'rungs']]);
    expect(d[0].message).toMatch(/unknown key "pacse"; did you mean "paces"\?/);
    // The script itself carries no copy of the config file's problem.
    expect(c.diagnostics.get(scriptA)!.diagnostics.some((x) => x.code === 'unknown-key')).toBe(false);

    writeFileSync(configPath, CONFIG_GOOD);
    await c.connection.sendNotification('workspace/didChangeWatchedFiles', { changes: [{ uri: configUri, type: 2 }] });
    await c.waitFor(() => c.diagnostics.get(configUri)?.diagnostics.length === 0, 'config diagnostics cleared');
  });
});

describe('lexicon files', () => {
  it('are watched by their resolved path, whatever they are called', async () => {
    const watched = () =>
      [...c.registrations.values()]
        .filter((r) => r.method === 'workspace/didChangeWatchedFiles')
        .flatMap((r) => (r.registerOptions as { watchers: { globPattern: unknown }[] }).watchers.map((w) => w.globPattern));
    await c.waitFor(
      () => watched().some((g) => typeof g === 'object' && (g as { pattern: string }).pattern === 'names.txt'),
      'a watcher for names.txt',
    );
    expect(watched()).toContainEqual({ baseUri: fileUri(folderA), pattern: 'names.txt' });
    expect(watched()).toContainEqual('**/{.rungs.json,.rungs.yaml,.rungs.yml}');
  });

  it('a change to names.txt re-checks the script: an estimate becomes the lexicon entry', async () => {
    expect(await hoverText(scriptA, 1, 2)).toContain('≈ estimated pronunciation');
    writeFileSync(namesPath, '// Names the dictionary does not list.\nTeodric = T EY1 OW0 D R IH0 K\n');
    const since = c.analyzed.length;
    await c.connection.sendNotification('workspace/didChangeWatchedFiles', { changes: [{ uri: fileUri(namesPath), type: 2 }] });
    await reanalysed(scriptA, since);
    const text = await hoverText(scriptA, 1, 2);
    expect(text).not.toContain('estimated');
    expect(text).toContain('`T EY1 OW0 D R IH0 K`');
  });

  it('lexicon problems are published on the lexicon file', async () => {
    writeFileSync(namesPath, 'Teodric = T EY1 OW0 D R IH0 K\nQuux = QQ\n');
    await c.connection.sendNotification('workspace/didChangeWatchedFiles', { changes: [{ uri: fileUri(namesPath), type: 2 }] });
    const uri = fileUri(namesPath);
    await c.waitFor(() => (c.diagnostics.get(uri)?.diagnostics.length ?? 0) > 0, 'diagnostics of names.txt');
    expect(c.diagnostics.get(uri)!.diagnostics.map((d) => d.range.start.line)).toEqual([1]);
  });
});

describe('workspace folders', () => {
  it('a script outside every folder uses the first folder for editor lexicon paths', async () => {
    await openSettled(scriptB, TEXT_B);
    expect(await hoverText(scriptB, 1, 2)).toContain('≈ estimated pronunciation');
  });

  it('an added folder (non-ASCII, spaces) is used from then on', async () => {
    const since = c.analyzed.length;
    await c.connection.sendNotification('workspace/didChangeWorkspaceFolders', {
      event: { added: [{ uri: fileUri(folderB), name: 'B' }], removed: [] },
    });
    await reanalysed(scriptB, since);
    const text = await hoverText(scriptB, 1, 2);
    expect(text).not.toContain('estimated');
    expect(text).toContain('`Z AO1 R B L AE0 T`');
  });
});
