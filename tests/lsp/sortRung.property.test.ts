// Property: whether a rung needs sorting, read from its items' difficulties (lsp/sortRung.ts
// itemOrder), is exactly whether the sort edit (rules/sortRegion.ts) would change the text, on
// random rungs: items with repeated and tied difficulties, comment lines that move with their
// item, blank lines, notes after items, silent items, both directions. The slow answer builds
// the sorted text and compares it with the rung's text; it is the definition.
import { fc, test } from '@fast-check/vitest';
import { expect } from 'vitest';
import { splitLines } from '../../server/src/core/parse';
import { itemOrder, rungNeedsSort, sortRung } from '../../server/src/lsp/sortRung';
import type { Snapshot } from '../../server/src/lsp/documents';
import { analyzeText } from '../helpers/data';

const LINES = [
  'Hi.', 'Hi.', 'Good morning.', 'Pass the bread, please.', 'The orthodontist recommended periodontal treatment.', 'Come in.',
  'come in!', 'Where is my cup? | note', '...', '// a comment', '', 'My granddaughter visits every Sunday afternoon.',
];

test.prop([fc.array(fc.constantFrom(...LINES), { minLength: 1, maxLength: 12 }), fc.constantFrom('rising', 'falling')], { numRuns: 500 })(
  'the quick answer equals building the sort edit',
  (lines, direction) => {
    const text = `@direction ${direction}\n== One\n${lines.join('\n')}\n== Two\nHi.\n`;
    const analysis = analyzeText(text);
    const s = { uri: 'file:///w/a.rungs', analysis, text, lines: splitLines(text) } as unknown as Snapshot;
    const dir = direction === 'falling' ? -1 : 1;
    for (const rung of analysis.rungs) {
      const slow = sortRung(s, rung) !== null;
      const order = itemOrder(rung, dir);
      if (order !== 'unknown') expect(order === 'out of order').toBe(slow);
      expect(rungNeedsSort(s, rung)).toBe(slow);
    }
  },
);
