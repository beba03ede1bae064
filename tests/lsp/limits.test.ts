// Over LSP: the server bounds what the editor sends (a document over 32 MiB, the CLI's file bound,
// is analysed up to the bound and reported by over-limit; a line over 10,000 characters likewise)
// and looks for config files up to the workspace folder only, where `rungs lint` walks on up.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../server/src/cli/main';
import { nodeFs } from '../../server/src/cli/nodeIo';
import { MAX_FILE_BYTES } from '../../server/src/node/boundedRead';
import { fileUri, LspTestClient } from '../helpers/lspClient';

// <root>/.rungs.json lies above the workspace folder; <root>/ws/.rungs.json inside it.
const root = mkdtempSync(join(tmpdir(), 'rungs-lsp-limit-'));
const ws = join(root, 'ws');
mkdirSync(join(ws, 'sub'), { recursive: true });
writeFileSync(join(root, '.rungs.json'), '{ "rules": { "unknown-key": "off" } }\n');
writeFileSync(join(ws, '.rungs.json'), '{ "rules": { "thin-rung": "off" } }\n');
// A misspelt setting (unknown-key) and a rung of one item (thin-rung).
const SMALL = '@pacse 1\n== One\nHi there.\n';
const scriptPath = join(ws, 'sub', 'a.rungs');
writeFileSync(scriptPath, SMALL);

let c: LspTestClient;
beforeAll(async () => {
  c = new LspTestClient();
  await c.initialize(ws);
});
afterAll(async () => {
  await c.close();
  rmSync(root, { recursive: true, force: true });
});

describe('config files in the language server', () => {
  it('are read up to the workspace folder, not above it', async () => {
    const uri = fileUri(scriptPath);
    await c.open(uri, SMALL);
    const rules = (await c.diagnosticsFor(uri, 1)).map((d) => d.code);
    expect(rules).toContain('unknown-key'); // the file above the workspace is not read
    expect(rules).not.toContain('thin-rung'); // the one inside it is
  });

  it('while rungs lint walks up to the root and reads both', async () => {
    let out = '';
    const code = await main({ argv: ['lint', scriptPath], cwd: ws, fs: nodeFs, stdout: (t) => (out += t), stderr: () => {}, env: {} });
    expect(out).not.toContain('unknown-key');
    expect(out).not.toContain('thin-rung');
    expect(code).toBe(0);
  });
});

describe('documents over the bounds', () => {
  it('a line over 10,000 characters is reported at its 10,001st character', async () => {
    const uri = fileUri(join(ws, 'line.rungs'));
    const long = 'Hi there, '.repeat(1500); // 15,000 characters (computed)
    await c.open(uri, `== One\nHi there.\n${long}\nSee you soon.\n`);
    const d = (await c.diagnosticsFor(uri, 1)).find((x) => x.code === 'over-limit');
    expect(d?.range).toEqual({ start: { line: 2, character: 10_000 }, end: { line: 2, character: 15_000 } });
    expect(d?.message).toBe('this line has 15000 characters; only the first 10000 are checked');
  });

  it('a document over 32 MiB is analysed up to the bound', async () => {
    const uri = fileUri(join(ws, 'big.rungs'));
    // Comment lines of 8,004 bytes with their breaks (computed): the first N whole lines within
    // 32 MiB are read, N = floor((32 MiB - head) / 8,004); the head is ASCII, so bytes = characters.
    const head = '@pacse 1\n== One\nHi there.\nSee you soon.\nFine, thanks.\n';
    const comment = `// ${'x'.repeat(8000)}\n`;
    const count = Math.ceil(MAX_FILE_BYTES / comment.length) + 10;
    await c.open(uri, head + comment.repeat(count));
    const checked = 5 + Math.floor((MAX_FILE_BYTES - head.length) / comment.length);
    const diags = await c.diagnosticsFor(uri, 1);
    const d = diags.find((x) => x.code === 'over-limit');
    expect(d?.message).toBe(`the script is larger than 32 MiB: checked up to line ${checked} only`);
    expect(d?.range.start).toEqual({ line: checked, character: 0 });
    // What lies before the bound is still checked.
    expect(diags.some((x) => x.code === 'unknown-key' && x.range.start.line === 0)).toBe(true);
  });
});
