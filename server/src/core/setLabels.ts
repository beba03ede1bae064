// Where an item's own `@set` labels sit on its line, so the balancer and the editor can point at
// (and rewrite) exactly those characters and nothing else.
import { NOTE_MARK, SET_ATTR, splitLabels } from './parse';
import type { ItemNode, TextEdit } from './types';

export interface LabelSpan {
  label: string;
  /** 0-based character offsets on the line, end exclusive. */
  start: number;
  end: number;
}

/** The `@set` labels written in an item's trailer (after `|`), with their positions. */
export function itemLabelSpans(lineText: string, item: ItemNode): LabelSpan[] {
  const bar = lineText.indexOf(NOTE_MARK, item.textStart);
  if (bar < 0) return [];
  const trailer = lineText.slice(bar + 1);
  const spans: LabelSpan[] = [];
  for (const m of trailer.matchAll(new RegExp(SET_ATTR.source, 'g'))) {
    const groupStart = bar + 1 + m.index! + m[0].lastIndexOf(m[2]);
    let from = 0;
    for (const label of splitLabels(m[2])) {
      const at = m[2].indexOf(label, from);
      from = at + label.length;
      spans.push({ label, start: groupStart + at, end: groupStart + at + label.length });
    }
  }
  return spans;
}

/** An edit that replaces an item's single own label; null when the item has not exactly one. */
export function relabelEdit(lineText: string, item: ItemNode, label: string): TextEdit | null {
  const spans = itemLabelSpans(lineText, item);
  if (spans.length !== 1) return null;
  const s = spans[0];
  return { line: item.line, character: s.start, endLine: item.line, endCharacter: s.end, newText: label };
}
