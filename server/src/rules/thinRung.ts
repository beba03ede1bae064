// thin-rung: a rung with fewer items than the script's minimum.
import { eachRung, type Rule } from './types';
import { rungLabel, rungRange } from './shared';

export const thinRung: Rule = {
  id: 'thin-rung',
  summary: 'A rung holds fewer items than `@min-items` (default 3).',
  defaultSeverity: 'warning',
  category: 'ladder',
  docs: [
    'A level needs enough items for practice and for a stable median. Every rung with fewer items',
    'than `@min-items` (default 3; 0 turns the check off) is reported on its header with the count',
    'and the minimum. An empty rung is reported too. Fix it by adding items or by merging the rung',
    'into a neighbour. A script without rung headers is a plain list, not a ladder, and is not checked.',
  ].join(' '),
  ...eachRung((ctx, r, report) => {
    const min = ctx.analysis.options.minItems;
    if (!(min > 0)) return;
    // A file of bare sentences is one implicit rung: a list to score, not a ladder to grade.
    if (ctx.analysis.rungs.length === 1 && ctx.analysis.rungs[0].node.implicit) return;
    const n = r.items.length;
    if (n >= min) return;
    report({
      ...rungRange(ctx, r),
      message: `${rungLabel(r)} has ${n === 0 ? 'no items' : `${n} item${n === 1 ? '' : 's'}`}; rungs need at least ${min} (@min-items)`,
    });
  }),
};
