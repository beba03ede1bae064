// The code lens over the protocol after edits: each rung's summary and session length are kept per
// rung, so an edit changes the lens of the rung it touched and leaves the others as they were,
// and asking again for the same version gives the same lenses. Lengths are computed by hand:
// speech is words / pace, plus a 2 s gap between items (the default `@item-gap`).
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CodeLens } from 'vscode-languageserver-protocol';
import { fileUri, LspTestClient } from '../helpers/lspClient';

const root = mkdtempSync(join(tmpdir(), 'rungs-lens-'));
const uri = fileUri(join(root, 'lens.rungs'));
const TEXT = '@paces 1, 2 wps\n== Short\nHi there.\nSee you soon.\n== Long\nThank you for coming today.\nPlease sit down.\n';

let c: LspTestClient;
const sessions = async () =>
  (await c.request<CodeLens[]>('textDocument/codeLens', { textDocument: { uri } }))
    .filter((l) => l.command?.title.startsWith('session '))
    .map((l) => [l.range.start.line, l.command!.title]);

beforeAll(async () => {
  c = new LspTestClient();
  await c.initialize(root);
  await c.open(uri, TEXT);
  await c.diagnosticsFor(uri, 1);
});
afterAll(async () => {
  await c?.close();
});

describe('the code lens after edits', () => {
  it('shows each rung\'s session length from the timing plan', async () => {
    // computed: Short 2 + 3 words = 5 s at 1 wps + one 2 s gap = 7 s; at 2 wps 2.5 + 2 = 4.5 s.
    // Long 5 + 3 words = 8 s + 2 = 10 s; at 2 wps 4 + 2 = 6 s.
    expect(await sessions()).toEqual([
      [1, 'session 7 s at 1 wps, 4.5 s at 2 wps (with 2 s gaps)'],
      [4, 'session 10 s at 1 wps, 6 s at 2 wps (with 2 s gaps)'],
    ]);
    expect(await sessions()).toEqual(await sessions());
  });

  it('an edit in one rung changes that rung\'s length only', async () => {
    // "Please sit down." becomes "Please sit down now." (4 words).
    const v = await c.change(uri, [{ range: { start: { line: 6, character: 15 }, end: { line: 6, character: 15 } }, text: ' now' }]);
    await c.diagnosticsFor(uri, v);
    // computed: Long 5 + 4 words = 9 s + 2 = 11 s; at 2 wps 4.5 + 2 = 6.5 s. Short is unchanged.
    expect(await sessions()).toEqual([
      [1, 'session 7 s at 1 wps, 4.5 s at 2 wps (with 2 s gaps)'],
      [4, 'session 11 s at 1 wps, 6.5 s at 2 wps (with 2 s gaps)'],
    ]);
  });

  it('a line added above a rung moves its lens and keeps its length', async () => {
    const v = await c.change(uri, [{ range: { start: { line: 3, character: 13 }, end: { line: 3, character: 13 } }, text: '\nGood night.' }]);
    await c.diagnosticsFor(uri, v);
    // computed: Short 2 + 3 + 2 words = 7 s + two gaps = 11 s; at 2 wps 3.5 + 4 = 7.5 s.
    expect(await sessions()).toEqual([
      [1, 'session 11 s at 1 wps, 7.5 s at 2 wps (with 2 s gaps)'],
      [5, 'session 11 s at 1 wps, 6.5 s at 2 wps (with 2 s gaps)'],
    ]);
  });
});
