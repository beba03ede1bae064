// step-backwards: a rung easier than the one before it, in a ladder that should climb.
import type { Rule } from './types';
import { fmt, METRIC_NAMES, ladderMetric, rungLabel, rungRange, rungRelated, rungStats, sign } from './shared';

export const stepBackwards: Rule = {
  id: 'step-backwards',
  summary: 'A rung is easier than the rung before it, against the script\'s direction.',
  defaultSeverity: 'warning',
  category: 'ladder',
  docs: [
    'Compares the median difficulty (or the configured ladder metric) of each rung with the rung',
    'before it. In a rising ladder (the default, `@direction rising`) every rung should be at least',
    'as hard as the one before; in a falling ladder at least as easy. A step back by more than 0.5',
    'points is reported on the later rung, with both medians and the size of the step. Fix it by',
    'moving the rung to where its difficulty belongs, or by changing its items.',
  ].join(' '),
  check(ctx, report) {
    const stats = rungStats(ctx);
    const dir = sign(ctx);
    const what = METRIC_NAMES[ladderMetric(ctx)];
    const word = dir === 1 ? 'below' : 'above';
    const kind = dir === 1 ? 'rising' : 'falling';
    for (let i = 1; i < stats.length; i++) {
      const prev = stats[i - 1];
      const cur = stats[i];
      const back = (prev.median - cur.median) * dir;
      if (back <= 0.5) continue;
      const metric = what === 'difficulty' ? '' : ` ${what}`;
      report({
        ...rungRange(ctx, cur.rung),
        message:
          `${rungLabel(cur.rung)} median${metric} ${fmt(cur.median)} is ${fmt(back)} ${word} ` +
          `${rungLabel(prev.rung)} (${fmt(prev.median)}); a ${kind} ladder should not step back`,
        related: [rungRelated(ctx, prev.rung, `${rungLabel(prev.rung)}: median ${fmt(prev.median)}`)],
      });
    }
  },
};
