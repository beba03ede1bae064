// small-set: a matched set with too few items to compare.
import { setComparison, setRange } from './setRules';
import type { Rule } from './types';

export const smallSet: Rule = {
  id: 'small-set',
  summary: 'A `@set` set holds fewer items than `@set-min-items` (default 5), too few to compare.',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'A set needs enough items for its mean and spread to mean anything. When two or more set labels',
    'meet in the scope compared (the whole script, or each rung with `@set-scope rung`), every set',
    'there with fewer than `@set-min-items` items (default 5) is reported and left out of the',
    'equivalence check. Add items, compare over the whole script, or lower the minimum.',
  ].join(' '),
  check(ctx, report) {
    const c = setComparison(ctx.analysis);
    for (const s of c.small) {
      const where = s.rung === null ? 'in the script' : `in rung ${s.rung + 1} "${s.rungName}"`;
      report({
        ...setRange(ctx, s.label, s.rung, s.lines),
        message: `set "${s.label}" has ${s.n} item${s.n === 1 ? '' : 's'} ${where}; a set needs at least ${c.minItems} to be compared (@set-min-items)`,
      });
    }
  },
};
