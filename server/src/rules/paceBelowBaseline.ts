// pace-below-baseline: a pace slower than the client already speaks unassisted.
import { formatNumber } from '../core/pace';
import type { Rule } from './types';
import { paceRange, rungLabel, rungWordRate } from './shared';

const f2 = (n: number) => formatNumber(n, 2);

export const paceBelowBaseline: Rule = {
  id: 'pace-below-baseline',
  summary: "A pace is slower than the client's baseline rate (`@baseline`).",
  defaultSeverity: 'warning',
  category: 'pace',
  docs: [
    "When the script sets the client's unassisted rate (`@baseline 0.8 wps`), a model paced below it",
    'asks the client to slow down rather than supporting a faster rate; a ratio of 1.2 (20 % faster)',
    'is the usual mark of a meaningful gain. For each rung and pace the rule works out the implied',
    'word rate (a syllables-per-second pace through the rung\'s syllables per word) and reports the',
    'pace line when it is below the baseline, with the pace, the baseline and their ratio. Each pace',
    'is reported once, on the first rung where it is too slow. Silent when no baseline is set.',
  ].join(' '),
  check(ctx, report) {
    const base = ctx.analysis.options.baseline;
    if (!base || !(base > 0)) return;
    const done = new Set<string>();
    for (const r of ctx.analysis.rungs) {
      if (!r.items.length) continue;
      const range = paceRange(ctx, r);
      for (const pace of r.paces) {
        const key = `${range.line}:${pace.label}`;
        const wps = rungWordRate(r, pace);
        if (done.has(key) || !(wps < base - 1e-9)) continue;
        done.add(key);
        const implied = pace.unit === 'wps' ? '' : ` (${f2(wps)} words/s on ${rungLabel(r)})`;
        report({
          ...range,
          message: `pace ${pace.label}${implied} is below the client's baseline of ${f2(base)} wps (ratio ${f2(wps / base)}); paced practice should start at or above the unassisted rate`,
        });
      }
    }
  },
};
