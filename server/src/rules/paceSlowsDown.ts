// pace-slows-down: a harder rung practised at a slower pace than the rung before it.
import { formatNumber } from '../core/pace';
import type { Pace, PaceUnit } from '../core/types';
import type { Rule } from './types';
import { fmt, paceRange, rungLabel, rungRelated, rungStats } from './shared';
import { maxOf, minOf } from '../core/arrays';

function extremes(paces: Pace[], unit: PaceUnit): { low: number; high: number } | null {
  const vs = paces.filter((p) => p.unit === unit).map((p) => p.value);
  return vs.length ? { low: minOf(vs), high: maxOf(vs) } : null;
}

export const paceSlowsDown: Rule = {
  id: 'pace-slows-down',
  summary: 'A rung is harder than the one before it but its paces are slower.',
  defaultSeverity: 'warning',
  category: 'pace',
  docs: [
    'Along a ladder the target paces should hold or rise as the items get harder, so the client',
    'is not asked to go back to a slower model on a harder level by accident. For neighbouring rungs',
    'where the later one has the higher median difficulty, the rule compares their slowest and their',
    'fastest paces, unit by unit (words per second with words per second, syllables per second with',
    'syllables per second), and reports the later rung\'s pace line when either is lower, with both',
    'paces and both medians. Set the rung\'s `@pace` on purpose and allow it with a directive when',
    'the slower pace is the clinical plan.',
  ].join(' '),
  check(ctx, report) {
    const stats = rungStats(ctx);
    for (let i = 1; i < stats.length; i++) {
      const prev = stats[i - 1];
      const cur = stats[i];
      if (!(cur.median > prev.median)) continue;
      for (const unit of ['wps', 'sps'] as PaceUnit[]) {
        const a = extremes(prev.rung.paces, unit);
        const b = extremes(cur.rung.paces, unit);
        if (!a || !b) continue;
        const which = b.high < a.high ? 'fastest' : b.low < a.low ? 'slowest' : null;
        if (!which) continue;
        const [was, now] = which === 'fastest' ? [a.high, b.high] : [a.low, b.low];
        report({
          ...paceRange(ctx, cur.rung),
          message:
            `the ${which} pace of ${rungLabel(cur.rung)}, ${formatNumber(now, 3)} ${unit}, is slower than ` +
            `${formatNumber(was, 3)} ${unit} in ${rungLabel(prev.rung)}, while the median difficulty rises ` +
            `from ${fmt(prev.median)} to ${fmt(cur.median)}`,
          related: [rungRelated(ctx, prev.rung, `${rungLabel(prev.rung)}: ${which} pace ${formatNumber(was, 3)} ${unit}`)],
        });
        break;
      }
    }
  },
};
