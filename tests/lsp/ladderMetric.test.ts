// With `ladder: {metric: syllables, maxStep: 3}` in a config file, the rules, the ladder view
// (`rungs/ladder`), the rung hover and the code lens must all judge syllables with a step of 3,
// not the composite difficulty and `@max-step`. Checked over the protocol against a spawned server.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CodeLens, Hover } from 'vscode-languageserver-protocol';
import type { Ladder } from '../../server/src/lsp/contract';
import { words } from '../helpers/data';
import { fileUri, LspTestClient } from '../helpers/lspClient';

const dir = mkdtempSync(join(tmpdir(), 'rungs-metric-'));
// Item order within a rung is not under test here.
writeFileSync(join(dir, '.rungs.yaml'), 'ladder:\n  metric: syllables\n  maxStep: 3\nrules:\n  unsorted-rung: "off"\n');
const uri = fileUri(join(dir, 'steps.rungs'));
// @max-step 50 would let every difficulty step pass: only the syllable step of 3 can flag rung 2.
const TEXT = [
  '@max-step 50',
  '== One',
  'Yes.',
  'No.',
  'Hi.',
  '== Two',
  'Good morning to you.',
  'I like the garden.',
  'Come in and sit down.',
  '== Three',
  'Put on your coat and hat.',
  'We can go for a walk now.',
  'I would like a cup of tea.',
  '',
].join('\n');

/** Syllables of an item from the CMU Pronouncing Dictionary (vowel phones carry a stress digit). */
function syllables(item: string): number {
  return item
    .toLowerCase()
    .replace(/[^a-z' ]/g, '')
    .split(/\s+/)
    .filter(Boolean)
    .reduce((n, w) => n + (words.pronunciations(w)![0].match(/\d/g) ?? []).length, 0);
}
const median3 = (xs: number[]) => [...xs].sort((a, b) => a - b)[1];
const lines = TEXT.split('\n');
// computed from the dictionary: the medians of each rung's three items.
const medians = [median3(lines.slice(2, 5).map(syllables)), median3(lines.slice(6, 9).map(syllables)), median3(lines.slice(10, 13).map(syllables))];

let c: LspTestClient;
beforeAll(async () => {
  c = new LspTestClient();
  await c.initialize(dir);
  await c.open(uri, TEXT);
  await c.waitFor(() => c.diagnostics.has(uri), 'diagnostics');
});
afterAll(() => c?.close());

describe('a configured ladder metric', () => {
  it('the fixture steps 4 then 2 syllables (dictionary counts)', () => {
    expect(medians).toEqual([1, 5, 7]);
  });

  it('diagnostics: step-too-big judges syllables against ladder.maxStep', () => {
    const steps = c.diagnostics.get(uri)!.diagnostics.filter((d) => d.code === 'step-too-big');
    expect(steps.map((d) => [d.range.start.line, d.message])).toEqual([
      [5, 'rung 2 "Two" median syllables 5.0 is 4.0 above rung 1 "One" (1.0); largest step is 3 (ladder.maxStep)'],
    ]);
  });

  it('rungs/ladder shows the same medians, step limit and flagged step', async () => {
    const ladder = await c.request<Ladder>('rungs/ladder', { uri });
    expect(ladder.metric).toBe('syllables');
    expect(ladder.maxStep).toBe(3);
    expect(ladder.rungs.map((r) => r.median)).toEqual(medians);
    expect(ladder.steps.map((s) => [s.delta, s.problem])).toEqual([
      [4, 'step-too-big'],
      [2, null],
    ]);
  });

  it('the rung hover and the code lens agree', async () => {
    const h = await c.request<Hover | null>('textDocument/hover', { textDocument: { uri }, position: { line: 5, character: 3 } });
    const text = h && typeof h.contents === 'object' && 'value' in h.contents ? h.contents.value : '';
    expect(text).toContain('Syllables 5–5, median **5**');
    expect(text).toContain('(median 1): **+4** (largest allowed 3, rising)');
    const lenses = await c.request<CodeLens[]>('textDocument/codeLens', { textDocument: { uri } });
    expect(lenses.find((l) => l.range.start.line === 5)?.command?.title).toContain('syllables 5–5, median 5');
  });
});
