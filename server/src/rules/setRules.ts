// What the matched-set rules share: one comparison per analysis (both rules read it) and where a
// finding about a set is shown.
import { compareSets, type SetComparison } from '../core/sets';
import { itemLabelSpans } from '../core/setLabels';
import type { Analysis, Range } from '../core/types';
import { rungRange } from './shared';
import type { RuleContext } from './types';

export const SET_RULE_IDS = ['unmatched-sets', 'small-set'];

const cache = new WeakMap<Analysis, SetComparison>();

export function setComparison(analysis: Analysis): SetComparison {
  let c = cache.get(analysis);
  if (!c) {
    c = compareSets(analysis);
    cache.set(analysis, c);
  }
  return c;
}

/**
 * Where to report on a set: its rung's header when compared rung by rung, else the `@set` label of
 * its first item (or that item's text when the label is inherited from a header).
 */
export function setRange(ctx: RuleContext, label: string, rung: number | null, lines: number[]): Range {
  if (rung !== null && !ctx.analysis.rungs[rung].node.implicit) return rungRange(ctx, ctx.analysis.rungs[rung]);
  const item = ctx.analysis.items.find((i) => i.node.line === lines[0])!;
  const span = itemLabelSpans(ctx.lines[item.node.line] ?? '', item.node).find((s) => s.label === label);
  if (span) return { line: item.node.line, character: span.start, endLine: item.node.line, endCharacter: span.end };
  return { line: item.node.line, character: item.node.textStart, endLine: item.node.line, endCharacter: Math.max(item.node.textEnd, item.node.textStart + 1) };
}
