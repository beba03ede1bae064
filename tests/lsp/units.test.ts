// Unit tests of the language server's and the client's pure parts that the protocol tests cannot
// reach: fixes marked quick-fix only, settings validation, the watcher list, and how the status
// bar and the ladder view mark numbers resting on estimated pronunciations.
import { describe, expect, it } from 'vitest';
import type { CodeAction, CodeActionParams } from 'vscode-languageserver-protocol';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { renderLadderBody } from '../../client/src/ladderHtml';
import { describeItem } from '../../client/src/present';
import type { Ladder } from '../../client/src/protocol';
import type { Problem } from '../../server/src/core/types';
import { codeActions, FIX_ALL_KIND } from '../../server/src/lsp/codeActions';
import { batchEdits } from '../../server/src/rules/fixes';
import { AnalysisStore } from '../../server/src/lsp/documents';
import { fileWatchers } from '../../server/src/lsp/watch';
import { normalizeSettings } from '../../server/src/lsp/settings';
import { words } from '../helpers/data';
import { applyTextEdits, editsFor } from '../helpers/lspClient';

describe('fix-all leaves out fixes marked batch: false', () => {
  const uri = 'file:///fixes.rungs';
  const text = '== R\nHello there.\nGood bye.\n';
  const at = (line: number, character: number, endCharacter: number) => ({ line, character, endLine: line, endCharacter });
  const problems: Problem[] = [
    { ...at(1, 0, 5), rule: 'a', severity: 'warning', message: 'batchable', fix: { title: 'Say hi', edits: [{ ...at(1, 0, 5), newText: 'Hi' }] } },
    { ...at(2, 0, 4), rule: 'b', severity: 'warning', message: 'one by one', fix: { title: 'Say so long', batch: false, edits: [{ ...at(2, 0, 4), newText: 'So long' }] } },
  ];
  const store = new AnalysisStore(words, { log: () => undefined, error: () => undefined, analyzed: () => undefined });
  const snap = { ...store.get(TextDocument.create(uri, 'rungs', 1, text)), problems };
  const params = (line: number, only?: string[]): CodeActionParams => ({
    textDocument: { uri },
    range: { start: { line, character: 1 }, end: { line, character: 1 } },
    context: { diagnostics: [], ...(only ? { only } : {}) },
  });

  it('batchEdits (the fix-all and the CLI --fix path) skips it', () => {
    expect(batchEdits(text, problems).map((e) => e.newText)).toEqual(['Hi']);
  });

  it('source.fixAll.rungs applies only the batchable fix', () => {
    const all = codeActions(snap, params(0, [FIX_ALL_KIND])).filter((a: CodeAction) => a.kind === FIX_ALL_KIND);
    expect(all).toHaveLength(1);
    expect(applyTextEdits(text, editsFor(all[0].edit!, uri))).toBe('== R\nHi there.\nGood bye.\n');
  });

  it('the batch: false fix is still offered as its own quick fix', () => {
    const quick = codeActions(snap, params(2)).filter((a: CodeAction) => a.kind === 'quickfix');
    expect(quick.map((a) => a.title)).toEqual(['Say so long']);
    expect(applyTextEdits(text, editsFor(quick[0].edit!, uri))).toBe('== R\nHello there.\nSo long bye.\n');
  });
});

describe('settings', () => {
  it('accept "hint" as a rule severity, and name it when a value is wrong', () => {
    const ok = normalizeSettings({ rules: { 'thin-rung': 'hint', 'step-too-big': 'off' } });
    expect(ok.warnings).toEqual([]);
    expect(ok.settings.rules).toEqual({ 'thin-rung': 'hint', 'step-too-big': 'off' });
    const bad = normalizeSettings({ rules: { 'thin-rung': 'loud' } });
    expect(bad.settings.rules).toEqual({});
    expect(bad.warnings).toEqual(['rungs.rules.thin-rung: "loud" is not error, warning, info, hint or off']);
  });
});

describe('file watchers', () => {
  it('config files by name, records files and scripts by pattern; each lexicon by its folder and name, or by name when relative patterns are unsupported', () => {
    const config = { globPattern: '**/{.rungs.json,.rungs.yaml,.rungs.yml}' };
    // Records files and scripts: rung hovers keep the records' latest ratios until a change is reported.
    const records = { globPattern: '**/*.{rungs,rates.csv,rates.tsv}' };
    expect(fileWatchers(['/w/Ü x/names.txt'], true)).toEqual([config, records, { globPattern: { baseUri: 'file:///w/%C3%9C%20x', pattern: 'names.txt' } }]);
    expect(fileWatchers(['/w/names[1].txt'], false)).toEqual([config, records, { globPattern: '**/names[[]1[]].txt' }]);
  });
});

describe('the client marks estimated numbers', () => {
  it('status bar: "≈" before the difficulty, and the words in the tooltip', () => {
    const base = { line: 3, difficulty: 42.06, rank: 2, rungName: 'Breakfast', pace: '1.5 wps', seconds: 2.6667 };
    const est = describeItem({ ...base, estimatedWords: 2 });
    expect(est.text).toBe('$(graph-line) ≈42.1 · 2.7 s @ 1.5 wps');
    expect(est.tooltip).toContain('≈ 2 words with an estimated pronunciation');
    const plain = describeItem({ ...base, estimatedWords: 0 });
    expect(plain.text).toBe('$(graph-line) 42.1 · 2.7 s @ 1.5 wps');
    expect(plain.tooltip).not.toContain('estimated');
  });

  it('ladder view: hollow points, "≈" in their tooltips and in the table', () => {
    const ladder: Ladder = {
      title: null,
      direction: 'rising',
      maxStep: 15,
      rungs: [
        { name: 'Known', line: 0, median: 10, min: 10, max: 10, paces: ['1 wps'], items: [{ line: 1, text: 'Hi.', difficulty: 10, rank: 1, estimatedWords: 0 }] },
        { name: 'Guessed', line: 3, median: 30, min: 20, max: 40, paces: ['1 wps'], items: [
          { line: 4, text: 'Teodric sings.', difficulty: 40, rank: 2, estimatedWords: 1 },
          { line: 5, text: 'Tea.', difficulty: 20, rank: 1 },
        ] },
      ],
      steps: [{ from: 0, to: 1, delta: 20, problem: null }],
      problems: [],
    };
    const html = renderLadderBody(ladder);
    const points = html.match(/<circle class="item"[^>]*>/g)!;
    expect(points).toHaveLength(3);
    expect(points.filter((p) => p.includes('data-estimated="1"'))).toHaveLength(1);
    expect(html).toContain('Teodric sings. — difficulty ≈40.0, rank 2 of 2 (line 5); ≈ 1 word with an estimated pronunciation</title>');
    expect(html).toContain('Tea. — difficulty 20.0, rank 1 of 2 (line 6)</title>');
    const rows = html.match(/<tr data-line="\d+"[^]*?<\/tr>/g)!;
    expect(rows[0]).toContain('<td>10.0</td>');
    expect(rows[1]).toContain('<td>≈30.0</td>');
    expect(rows[1]).toContain('title="≈ 1 word with an estimated pronunciation">≈1</td>');
    expect(html).toContain('Hollow points and ≈ mark difficulties that rest on words with an estimated pronunciation.');
  });
});
