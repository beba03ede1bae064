// unmatched-sets: a pair of matched sets not shown equivalent on a metric.
import { SET_METRICS } from '../core/sets';
import { pairTitle, pIs } from '../core/setTable';
import { setComparison, setRange } from './setRules';
import type { Rule } from './types';

const f2 = (n: number | null): string => (n === null ? '—' : n.toFixed(2));

export const unmatchedSets: Rule = {
  id: 'unmatched-sets',
  summary: 'Two `@set` sets are not shown equivalent on a metric (TOST within ±`@set-bound` SD).',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'Trained and untrained sets must be matched on what drives difficulty. For every pair of set',
    'labels (over the whole script, or rung by rung with `@set-scope rung`) and every metric (words,',
    'syllables, phonemes, WCM, mean and minimum Zipf, difficulty), two one-sided Welch tests (TOST,',
    'alpha .05 each) check that the difference lies within ±`@set-bound` standard deviations (default',
    '0.5, a project convention). A metric that is not shown equivalent is reported with Hedges\' g,',
    'its 95 % CI and both one-sided p-values. A non-significant t-test is not evidence of a match.',
    'Small sets rarely show equivalence: add items, or let `rungs sets FILE --balance` propose a',
    'better split of the items between the labels.',
  ].join(' '),
  check(ctx, report) {
    const c = setComparison(ctx.analysis);
    for (const pair of c.pairs) {
      const range = setRange(ctx, pair.a, pair.rung, pair.linesA);
      for (const m of SET_METRICS) {
        const x = pair.metrics[m.id];
        if (!x || x.equivalent) continue;
        const g = x.g === null ? 'g undefined' : `g = ${f2(x.g)} [95 % CI ${f2(x.gLow)}, ${f2(x.gHigh)}]`;
        const tost = x.tostPLower === null ? 'the sets do not vary' : `TOST ${pIs(x.tostPLower)} (lower) and ${pIs(x.tostPUpper)} (upper)`;
        report({
          ...range,
          message: `${pairTitle(pair)}: ${m.name} not shown equivalent within ±${c.bound} SD (${g}; ${tost}; means ${x.meanA.toFixed(m.digits)} vs ${x.meanB.toFixed(m.digits)})`,
        });
      }
    }
  },
};
