// The statistics Rungs uses to compare matched item sets. Pure functions over numbers: no
// options, no I/O. Distribution functions (t, normal) come from jstat; only the exact
// Mann-Whitney distribution is computed here.
export { summarize, type Summary } from './summary';
export { welch, pooledT, pooledSd, twoSidedP, type TTestResult } from './ttest';
export { hedgesG, type HedgesG } from './hedges';
export { tostWelch, averageSd, type TostResult } from './tost';
export {
  mannWhitney,
  exactUDistribution,
  uStatistic,
  EXACT_LIMIT,
  type MwuResult,
  type MwuMethod,
  type Alternative,
} from './mannWhitney';
