// pace-below-baseline: a pace slower than the client already speaks unassisted (a fact, not advice).
import { baselineRatio, belowBaseline } from '../core/pace';
import type { Rule } from './types';
import { reportPaces, rungLabel, rungWordRate, fmtLimit as f2 } from './shared';

export const paceBelowBaseline: Rule = {
  id: 'pace-below-baseline',
  summary: "A pace is slower than the client's baseline rate (`@baseline`).",
  // Info, not warning: a model slower than the client's own rate can be the point of the
  // practice, so the rule states a fact for the clinician to weigh rather than flagging a mistake.
  defaultSeverity: 'info',
  category: 'pace',
  docs: [
    "When the script sets the client's unassisted rate (`@baseline 0.8 wps`), the rule reports each",
    'pace slower than it, with the pace, the baseline and their ratio (pace divided by baseline).',
    'For each rung and pace it works out the implied word rate (a syllables-per-second pace through',
    "the rung's syllables per word) and reports the pace line when that rate is below the baseline.",
    'Each pace is reported once, on the first rung where it is below. Silent when no baseline is',
    'set. Pacing slower than the baseline can be intended, which is why the default severity is',
    'info rather than warning; raise it in a config file where it is not. A ratio of 1.2 (a pace',
    '20 % above the baseline) as the first paced target is common practice; the rule itself only',
    'compares with 1 (the baseline).',
  ].join(' '),
  check(ctx, report) {
    const base = ctx.analysis.options.baseline;
    if (!base || !(base > 0)) return;
    reportPaces(
      ctx,
      (r, pace) => {
        const wps = rungWordRate(r, pace);
        if (!belowBaseline(wps, base)) return null;
        const implied = pace.unit === 'wps' ? '' : ` (${f2(wps)} words/s on ${rungLabel(r)})`;
        return `pace ${pace.label}${implied} is below the client's baseline of ${f2(base)} wps (ratio ${f2(baselineRatio(wps, base)!)})`;
      },
      report,
    );
  },
};
