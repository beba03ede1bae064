// item-outlier: an item far from the spread of the other items in its rung.
import { eachRung, type Rule } from './types';
import { fmt, itemRange, ladderMetric, median, METRIC_NAMES, rungLabel, rungValues } from './shared';

/** Robust z-scores beyond this are outliers (a common cut-off for the MAD-based score). */
export const OUTLIER_Z = 2.5;
/** MAD × 1.4826 estimates the standard deviation of normally spread values. */
const MAD_SCALE = 1.4826;
/** Fewest items for a rung's spread to mean anything. */
const MIN_ITEMS = 4;

export const itemOutlier: Rule = {
  id: 'item-outlier',
  summary: 'An item is far easier or harder than the rest of its rung (robust z above 2.5).',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'For each rung of four or more items, takes the median difficulty (or the configured ladder',
    'metric) and the median absolute deviation (MAD), and scores every item as a robust z =',
    '(value - median) / (1.4826 × MAD). An item with |z| above 2.5 is reported with its value, the',
    'rung median, the MAD and z. The median and MAD are not pulled by the outlier itself, unlike',
    'the mean and standard deviation. A rung whose items mostly share one value (MAD 0) is skipped.',
    'Fix it by moving the item to a rung of its level, or by replacing it.',
  ].join(' '),
  ...eachRung((ctx, r, report) => {
    const metric = ladderMetric(ctx);
    if (r.items.length < MIN_ITEMS) return;
    // The rung's values on the ladder metric, as the ladder rules read them.
    const values = rungValues(r, metric);
    const mid = median(values);
    const mad = median(values.map((v) => Math.abs(v - mid)));
    if (!(mad > 0)) return;
    r.items.forEach((it, i) => {
      const z = (values[i] - mid) / (MAD_SCALE * mad);
      if (Math.abs(z) <= OUTLIER_Z) return;
      report({
        ...itemRange(it),
        message:
          `${METRIC_NAMES[metric]} ${fmt(values[i])} is far ${z > 0 ? 'above' : 'below'} the rest of ${rungLabel(r)} ` +
          `(median ${fmt(mid)}, MAD ${fmt(mad)}, robust z ${z > 0 ? '+' : ''}${fmt(z)}; limit ±${OUTLIER_Z})`,
      });
    });
  }),
};
