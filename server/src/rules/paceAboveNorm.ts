// pace-above-norm: a pace faster than adults read aloud.
import type { Rule } from './types';
import { paceRange, rungLabel, rungSyllableRate, rungWordRate, fmtLimit as f2 } from './shared';

/** English read text runs near 6.2 syllables/s (Pellegrino, Coupé & Marsico 2011, Language 87(3); from memory). */
export const READING_NORM_SPS = 6.2;


export const paceAboveNorm: Rule = {
  id: 'pace-above-norm',
  summary: 'A pace implies a rate above adult reading-aloud norms (3.05 words/s or 6.2 syllables/s).',
  defaultSeverity: 'warning',
  category: 'pace',
  docs: [
    'Paced practice for non-fluent speech runs well below typical adult rates, so a pace above them',
    'is most likely a typo (e.g. wpm written as wps). For each rung and each of its paces the rule',
    'works out the implied word rate and syllable rate over the rung\'s items (a words-per-second',
    'pace implies syllables per second through the items\' syllables per word, and the other way',
    'round) and reports the pace line when the word rate is above `@reading-norm` (default 3.05',
    'words/s, 183 words/min: Brysbaert 2019, J Mem Lang 109) or the syllable rate is above 6.2',
    'syllables/s (English read text, Pellegrino, Coupé & Marsico 2011; from memory). Each pace is',
    'reported once, on the first rung where it is too fast.',
  ].join(' '),
  check(ctx, report) {
    const norm = ctx.analysis.options.readingNormWps;
    const done = new Set<string>();
    for (const r of ctx.analysis.rungs) {
      if (!r.items.length) continue;
      const range = paceRange(ctx, r);
      for (const pace of r.paces) {
        const key = `${range.line}:${pace.label}`;
        if (done.has(key)) continue;
        const wps = rungWordRate(r, pace);
        const sps = rungSyllableRate(r, pace);
        const reasons: string[] = [];
        if (wps > norm + 1e-9) reasons.push(`${f2(wps)} words/s, above the adult reading-aloud rate of ${f2(norm)} words/s (Brysbaert 2019)`);
        if (sps > READING_NORM_SPS + 1e-9) reasons.push(`${f2(sps)} syllables/s, above the ${READING_NORM_SPS} syllables/s of read English`);
        if (!reasons.length) continue;
        done.add(key);
        report({ ...range, message: `pace ${pace.label} on ${rungLabel(r)} implies ${reasons.join(' and ')}` });
      }
    }
  },
};
