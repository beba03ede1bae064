// pace-above-norm: a pace faster than adults read aloud.
import { fasterThanReadingSyllables, fasterThanReadingWords, READING_NORM_SPS } from '../core/pace';
import type { Rule } from './types';
import { reportPaces, rungLabel, rungSyllableRate, rungWordRate, fmtLimit as f2 } from './shared';

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
    reportPaces(
      ctx,
      (r, pace) => {
        const wps = rungWordRate(r, pace);
        const sps = rungSyllableRate(r, pace);
        const reasons: string[] = [];
        if (fasterThanReadingWords(wps, norm)) reasons.push(`${f2(wps)} words/s, above the adult reading-aloud rate of ${f2(norm)} words/s (Brysbaert 2019)`);
        if (fasterThanReadingSyllables(sps)) reasons.push(`${f2(sps)} syllables/s, above the ${READING_NORM_SPS} syllables/s of read English`);
        return reasons.length ? `pace ${pace.label} on ${rungLabel(r)} implies ${reasons.join(' and ')}` : null;
      },
      report,
    );
  },
};
