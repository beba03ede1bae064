// The caution every report carries: Rungs informs, it does not diagnose.
export const CAUTION =
  'Caution: these scores and timings support clinical judgement; they are not a diagnosis and defer to the treating clinician and local practice. ' +
  'Pronunciations are General American citation forms (estimated words are estimates), frequencies are US subtitle counts, and durations leave out pauses.';
