// rungs-overlap: neighbouring rungs whose difficulty ranges are nearly the same.
import type { Rule } from './types';
import { fmt, rungLabel, rungRange, rungRelated, rungStats } from './shared';

/** Ranges sharing at least this share of their union count as not differing. */
export const OVERLAP_LIMIT = 0.75;

export const rungsOverlap: Rule = {
  id: 'rungs-overlap',
  summary: 'Two neighbouring rungs cover almost the same range of difficulty.',
  defaultSeverity: 'warning',
  category: 'ladder',
  docs: [
    'Compares the difficulty range (easiest to hardest item) of each rung with the rung before it.',
    'When the shared part of the two ranges is at least 75 % of their combined span, the rungs do',
    'not differ enough to be separate levels, and the later rung is reported with both ranges and',
    'the overlap. Rungs of one item each, and ranges of zero width, are compared by their values.',
    'Fix it by merging the rungs or by moving the harder items up a rung.',
  ].join(' '),
  check(ctx, report) {
    const stats = rungStats(ctx);
    for (let i = 1; i < stats.length; i++) {
      const a = stats[i - 1];
      const b = stats[i];
      const union = Math.max(a.max, b.max) - Math.min(a.min, b.min);
      const shared = Math.min(a.max, b.max) - Math.max(a.min, b.min);
      const share = union > 0 ? Math.max(0, shared) / union : 1;
      if (share < OVERLAP_LIMIT) continue;
      report({
        ...rungRange(ctx, b.rung),
        message:
          `${rungLabel(b.rung)} (range ${fmt(b.min)}-${fmt(b.max)}) overlaps ${rungLabel(a.rung)} ` +
          `(${fmt(a.min)}-${fmt(a.max)}) by ${Math.round(share * 100)} % of their span; ` +
          `rungs should differ (limit ${Math.round(OVERLAP_LIMIT * 100)} %)`,
        related: [rungRelated(ctx, a.rung, `${rungLabel(a.rung)}: range ${fmt(a.min)}-${fmt(a.max)}`)],
      });
    }
  },
};
