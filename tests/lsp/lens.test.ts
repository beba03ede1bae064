// The code lens over the protocol after edits: each rung's summary and session length are kept per
// rung, so an edit changes the lens of the rung it touched and leaves the others as they were,
// and asking again for the same version gives the same lenses. Lengths are computed by hand:
// speech is words / pace, plus a 2 s gap between items (the default `@item-gap`).
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CodeLens } from 'vscode-languageserver-protocol';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { codeLenses, SORT_RUNG_COMMAND } from '../../server/src/lsp/codeLens';
import { AnalysisStore } from '../../server/src/lsp/documents';
import { fileUri, LspTestClient } from '../helpers/lspClient';
import { words } from '../helpers/data';

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

describe('lenses kept per rung', () => {
  // The lenses of each version, kept rung by rung, must equal those worked out afresh for the
  // same text (a new store: new rung analyses, nothing kept). Random edits of a small ladder:
  // typing, lines added and removed, rung headers added, script settings that change what the
  // lenses show (item gap, direction, paces), and an estimated name.
  const quiet = { log: () => undefined, error: () => undefined, analyzed: () => undefined };
  const u = 'file:///w/kept.rungs';
  const START = ['@paces 1, 2 wps', '== One', 'Hi there.', 'See you soon.', 'Teodric waves.', '== Two', 'Thank you for coming today.', 'Please sit down.', 'Good morning to you all.'];
  const EDITS: ((lines: string[], i: number) => void)[] = [
    (l, i) => (l[i] = `${l[i]} again`),
    (l, i) => l.splice(i, 0, 'A cup of tea, please.'),
    (l, i) => l.length > 2 && l.splice(i, 1),
    (l, i) => l.splice(i, 0, '== Inserted'),
    (l) => l.splice(1, 0, '@item-gap 3'),
    (l) => l.splice(1, 0, '@direction falling'),
    (l) => (l[0] = l[0] === '@paces 1, 2 wps' ? '@paces 1.5 wps' : '@paces 1, 2 wps'),
    (l, i) => (l[i] = l[i].replace(/o/, 'oo')),
  ];

  it('equal fresh lenses after each of 300 random edits', () => {
    let seed = 11;
    const rand = () => ((seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 2 ** 32);
    const store = new AnalysisStore(words, quiet);
    const lines = [...START];
    let doc = TextDocument.create(u, 'rungs', 1, lines.join('\n'));
    for (let step = 0; step < 300; step++) {
      EDITS[Math.floor(rand() * EDITS.length)](lines, Math.floor(rand() * lines.length));
      doc = TextDocument.update(doc, [{ text: lines.join('\n') }], doc.version + 1);
      const kept = codeLenses(store.get(doc));
      const fresh = codeLenses(new AnalysisStore(words, quiet).get(TextDocument.create(u, 'rungs', 1, doc.getText())));
      expect(kept, `after edit ${step + 1}:\n${doc.getText()}`).toEqual(fresh);
    }
  });

  it('follow the ladder metric and the document on the same rung analyses', () => {
    // A changed config (ladder.metric) or a renamed file gives a new snapshot over the same rung
    // analyses: their kept lenses must not be reused as they were.
    const s = new AnalysisStore(words, quiet).get(TextDocument.create(u, 'rungs', 1, START.join('\n')));
    const before = codeLenses(s);
    const bySyllables = codeLenses({ ...s, lint: { ...s.lint, ladder: { ...s.lint.ladder, metric: 'syllables' } } });
    expect(bySyllables[0].command!.title).toContain('syllables ');
    expect(bySyllables[0].command!.title).not.toBe(before[0].command!.title);
    const fresh = new AnalysisStore(words, quiet).get(TextDocument.create(u, 'rungs', 1, START.join('\n')));
    expect(bySyllables).toEqual(codeLenses({ ...fresh, lint: { ...fresh.lint, ladder: { ...fresh.lint.ladder, metric: 'syllables' } } }));
    const moved = codeLenses({ ...s, uri: 'file:///w/renamed.rungs' });
    const sorts = moved.filter((l) => l.command?.command === SORT_RUNG_COMMAND);
    expect(sorts.length).toBeGreaterThan(0);
    for (const l of sorts) expect(l.command!.arguments![0]).toBe('file:///w/renamed.rungs');
  });
});
