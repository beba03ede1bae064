// Matched sets in the editor: hover on a `@set` label, the "Balance sets in this rung" code action
// and the set marks of the ladder view, on the sample script with sets.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { CodeActionParams } from 'vscode-languageserver-protocol';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { renderLadderBody } from '../../client/src/ladderHtml';
import { parseScript } from '../../server/src/core/parse';
import { compareSets } from '../../server/src/core/sets';
import { itemLabelSpans } from '../../server/src/core/setLabels';
import { BALANCE_RUNG_TITLE } from '../../server/src/lsp/balanceRung';
import { codeActions } from '../../server/src/lsp/codeActions';
import { AnalysisStore } from '../../server/src/lsp/documents';
import { hover } from '../../server/src/lsp/hover';
import { ladder } from '../../server/src/lsp/ladder';
import { words } from '../helpers/data';
import { applyTextEdits, editsFor } from '../helpers/lspClient';
import { analyzeText } from '../helpers/data';

const uri = 'file:///kitchen-sets.rungs';
const text = readFileSync(join(__dirname, '..', '..', 'sample-scripts', 'kitchen-sets.rungs'), 'utf8');
const store = new AnalysisStore(words, { log: () => undefined, error: () => undefined, analyzed: () => undefined });
const snap = store.get(TextDocument.create(uri, 'rungs', 1, text));
const lines = text.split('\n');
const firstItemLine = lines.findIndex((l) => l.startsWith('Soup.'));

describe('hover on a @set label', () => {
  it('shows the balance table of the pair, with the same numbers as rungs sets', () => {
    const at = lines[firstItemLine].indexOf('trained');
    const h = hover(snap, firstItemLine, at + 2)!;
    const value = (h.contents as { value: string }).value;
    expect(h.range).toEqual({ start: { line: firstItemLine, character: at }, end: { line: firstItemLine, character: at + 'trained'.length } });
    expect(value).toContain('**Set "trained"**');
    expect(value).toContain('trained vs untrained, whole script');
    const words = compareSets(analyzeText(text)).pairs[0].metrics.words;
    expect(value).toContain(`| words | n 9 · ${words.meanA.toFixed(2)} ± ${words.sdA.toFixed(2)} |`);
    expect(value.match(/not shown equivalent/g)).toHaveLength(7);
  });

  it('the item text itself still shows the item hover', () => {
    const h = hover(snap, firstItemLine, 1)!;
    expect((h.contents as { value: string }).value).not.toContain('**Set');
  });
});

describe('hover on a label of a header or rung @set line', () => {
  it('shows the balance table of that set in its rung; the key keeps its own hover', () => {
    const t = ['@set-scope rung', '@set-min-items 2', '== One', '@set trained', 'Tea.', 'Milk.', 'Soup. | @set untrained', 'Rice. | @set untrained'].join('\n');
    const sn = store.get(TextDocument.create('file:///rung-sets.rungs', 'rungs', 1, t));
    const h = hover(sn, 3, 7)!;
    expect(h.range).toEqual({ start: { line: 3, character: 5 }, end: { line: 3, character: 12 } });
    const value = (h.contents as { value: string }).value;
    expect(value).toContain('**Set "trained"** · compared in this rung');
    expect(value).toContain('**trained vs untrained, rung 1 "One"**');
    // On the key itself the setting's own documentation shows.
    expect((hover(sn, 3, 2)!.contents as { value: string }).value).toContain('**@set**');
  });
});

describe('label spans', () => {
  it('find each label of an item trailer and nothing in its note', () => {
    const line = 'Pour the milk. | slowly, model first #milk1 @set trained, week2';
    const item = parseScript(line).rungs[0].items[0];
    expect(itemLabelSpans(line, item).map((s) => [s.label, line.slice(s.start, s.end)])).toEqual([['trained', 'trained'], ['week2', 'week2']]);
  });
});

describe('code action "Balance sets in this rung"', () => {
  const params = (line: number): CodeActionParams => ({
    textDocument: { uri },
    range: { start: { line, character: 0 }, end: { line, character: 0 } },
    context: { diagnostics: [] },
  });

  it('changes only @set labels of the rung under the cursor and improves the worst margin', () => {
    const rungLine = lines.findIndex((l) => l.startsWith('== Short requests'));
    const action = codeActions(snap, params(rungLine + 1)).find((a) => a.title === BALANCE_RUNG_TITLE)!;
    expect(action).toBeDefined();
    const edits = editsFor(action.edit!, uri);
    const rungItems = snap.analysis.rungs.find((r) => r.node.line === rungLine)!.items.map((i) => i.node.line);
    for (const e of edits) {
      expect(rungItems).toContain(e.range.start.line);
      expect(['trained', 'untrained']).toContain(lines[e.range.start.line].slice(e.range.start.character, e.range.end.character));
    }
    const after = applyTextEdits(text, edits);
    const worst = (t: string) => compareSets(analyzeText(t)).pairs[0].worstMargin;
    expect(worst(after)).toBeGreaterThan(worst(text));
    expect(after.replace(/@set \w+/g, '')).toBe(text.replace(/@set \w+/g, ''));
  });

  it('is not offered where no swap helps (computed: every split of "Shopping list" is worse) or nothing can swap', () => {
    const shopping = lines.findIndex((l) => l.startsWith('== Shopping list'));
    expect(codeActions(snap, params(shopping + 1)).map((a) => a.title)).not.toContain(BALANCE_RUNG_TITLE);
    const plain = store.get(TextDocument.create('file:///plain.rungs', 'rungs', 1, '== A\nTea.\nMilk.\n'));
    expect(codeActions(plain, { ...params(1), textDocument: { uri: 'file:///plain.rungs' } }).map((a) => a.title)).not.toContain(BALANCE_RUNG_TITLE);
  });
});

describe('ladder view set marks', () => {
  it('sends each item\'s sets and draws a lettered mark per item with a legend', () => {
    const l = ladder(snap);
    expect(l.rungs[0].items.map((i) => i.sets)).toEqual([['trained'], ['untrained'], ['untrained'], ['trained'], ['trained']]);
    const html = renderLadderBody(l);
    expect(html.match(/<text class="set-mark set-0" data-set="trained"[^>]*>T<\/text>/g)).toHaveLength(9);
    expect(html.match(/<text class="set-mark set-1" data-set="untrained"[^>]*>U<\/text>/g)).toHaveLength(8);
    expect(html).toContain('Sets: <span class="set-mark set-0">T</span> trained, <span class="set-mark set-1">U</span> untrained.');
  });
});
