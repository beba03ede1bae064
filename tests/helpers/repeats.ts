// The plain reference for duplicate-item: in script order, every item whose general key (the
// rule's definition, rules/itemKey.ts) an earlier item has, paired with that first item's line.
import type { ItemAnalysis } from '../../server/src/core/types';
import { generalSpokenKey } from '../../server/src/rules/itemKey';

/** [line of the repeat, line of the first item with its key] for each repeat, in order. */
export function plainRepeats(items: Iterable<ItemAnalysis>): [number, number][] {
  const first = new Map<string, number>();
  const out: [number, number][] = [];
  for (const it of items) {
    const key = generalSpokenKey(it.node.text);
    if (!key) continue;
    const at = first.get(key);
    if (at === undefined) first.set(key, it.node.line);
    else out.push([it.node.line, at]);
  }
  return out;
}
