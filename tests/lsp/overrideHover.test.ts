// The hover on a `@say` line's word: its range covers the word as written, accents and all,
// while the override is keyed by the form items are looked up by (precomposed: "zoë").
import { describe, expect, it } from 'vitest';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { AnalysisStore } from '../../server/src/lsp/documents';
import { hover } from '../../server/src/lsp/hover';
import { words } from '../helpers/data';

const store = new AnalysisStore(words, { log: () => undefined, error: () => undefined, analyzed: () => undefined });

describe('hover on a @say word', () => {
  it('covers the word as written, with a combining accent', () => {
    // "Zoe" + U+0308 is four UTF-16 units on the line; its key "zoë" is three.
    const text = '@say Zoe\u0308 = Z OW1 IY0\n== One\nZoë came.\n';
    const snap = store.get(TextDocument.create('file:///say-hover.rungs', 'rungs', 1, text));
    const h = hover(snap, 0, 9)!;
    expect(h.range).toEqual({ start: { line: 0, character: 5 }, end: { line: 0, character: 9 } });
    expect((h.contents as { value: string }).value).toContain('Z OW1 IY0');
    // The item's word takes the override.
    expect(snap.analysis.items[0].words[0]).toMatchObject({ spoken: 'zoë', source: 'override' });
  });
});
