// uneven-steps: one step of the ladder much larger than the others.
import type { Rule } from './types';
import { fmt, median, rungLabel, rungRange, rungRelated, rungStats } from './shared';

/** A step counts as uneven above this multiple of the median step. */
export const UNEVEN_FACTOR = 2;

export const unevenSteps: Rule = {
  id: 'uneven-steps',
  summary: 'One step between rungs is more than twice the median step of the ladder.',
  defaultSeverity: 'warning',
  category: 'ladder',
  docs: [
    'An even ladder climbs by similar amounts from rung to rung. The rule takes the size of every',
    'step (the absolute change of median difficulty, or of the configured ladder metric, between',
    'neighbouring rungs) and reports each step larger than twice the median step. It needs at least',
    'three steps (four rungs with items): with two, there is no "others" to compare with. The',
    'message lists all the steps. Fix it by splitting the big step with an intermediate rung or by',
    'moving items between rungs.',
  ].join(' '),
  check(ctx, report) {
    const stats = rungStats(ctx);
    if (stats.length < 4) return;
    const steps = stats.slice(1).map((s, i) => Math.abs(Number((s.median - stats[i].median).toFixed(1))));
    const mid = median(steps);
    if (!(mid > 0)) return;
    steps.forEach((step, i) => {
      if (step <= UNEVEN_FACTOR * mid) return;
      const from = stats[i].rung;
      const to = stats[i + 1].rung;
      report({
        ...rungRange(ctx, to),
        message:
          `the step from ${rungLabel(from)} to ${rungLabel(to)} is ${fmt(step)}, more than ` +
          `${UNEVEN_FACTOR} × the median step ${fmt(mid)} (steps: ${steps.map(fmt).join(', ')})`,
        related: [rungRelated(ctx, from, `${rungLabel(from)}: median ${fmt(stats[i].median)}`)],
      });
    });
  },
};
