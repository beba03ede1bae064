// The caution every report carries: Rungs informs, it does not diagnose.
export const CAUTION =
  'Caution: these scores and timings support clinical judgement; they are not a diagnosis and defer to the treating clinician and local practice. ' +
  'Pronunciations are General American citation forms (dialect and connected speech change them; estimated words are estimates), ' +
  'frequencies are US film-subtitle counts, and projected durations leave out pauses and phrase-final lengthening. Keep client data out of shared scripts.';
