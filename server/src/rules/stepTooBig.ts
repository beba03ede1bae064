// step-too-big: neighbouring rungs whose medians are further apart than the largest allowed step.
import type { Rule } from './types';
import { fmt, fmtLimit, METRIC_NAMES, ladderMetric, rungLabel, rungRange, rungRelated, rungStats, sign, stepLimit } from './shared';

export const stepTooBig: Rule = {
  id: 'step-too-big',
  summary: 'The climb from one rung to the next is larger than the largest allowed step.',
  defaultSeverity: 'warning',
  category: 'ladder',
  docs: [
    'Measures each step of the ladder: the change of median difficulty from one rung to the next',
    'in the script\'s direction. A step larger than `@max-step` (default 15 points of the 0-100',
    'scale; set in the script header or a config file) is reported on the later rung with both',
    'medians, the step and the limit. Steps backwards are left to `step-backwards`. With a',
    'single-metric ladder (`ladder.metric` in a config file) the limit is `ladder.maxStep`, and the',
    'rule is silent when that is not set. Fix it by adding an intermediate rung or easier items.',
  ].join(' '),
  check(ctx, report) {
    const metric = ladderMetric(ctx);
    const { value: limit, source } = stepLimit(ctx.analysis, ctx.settings);
    if (limit === undefined || !(limit > 0)) return;
    const what = metric === 'difficulty' ? '' : ` ${METRIC_NAMES[metric]}`;
    const stats = rungStats(ctx);
    const dir = sign(ctx);
    for (let i = 1; i < stats.length; i++) {
      const prev = stats[i - 1];
      const cur = stats[i];
      const step = (cur.median - prev.median) * dir;
      if (Number(step.toFixed(1)) <= limit) continue;
      report({
        ...rungRange(ctx, cur.rung),
        message:
          `${rungLabel(cur.rung)} median${what} ${fmt(cur.median)} is ${fmt(step)} ${dir === 1 ? 'above' : 'below'} ` +
          `${rungLabel(prev.rung)} (${fmt(prev.median)}); largest step is ${fmtLimit(limit)} (${source})`,
        related: [rungRelated(ctx, prev.rung, `${rungLabel(prev.rung)}: median ${fmt(prev.median)}`)],
      });
    }
  },
};
