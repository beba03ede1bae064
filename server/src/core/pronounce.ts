// Pronunciation of spoken words, in order of trust: a written override (script, then workspace
// lexicon), the CMU Pronouncing Dictionary (first listed pronunciation unless a variant is
// chosen), morphology on a dictionary stem, then the trained estimator (letter-to-sound rules
// when no model is loaded). Whatever did not come from the dictionary or an override is marked,
// so every display can say it is an estimate.
import type { Candidate } from './g2p/decode';
import { hiatusOf, plainSpelling } from './hiatus';
import { estimatePronunciation } from './lts/estimate';
import { lg10wf, zipf } from './frequency';
import { isVowel, parsePhones } from './phones';
import type { Override, PronunciationSource, WcmOptions, WordData, WordFigures } from './types';
import { wordComplexity } from './wcm';

export interface Pronunciation {
  phones: string[];
  source: PronunciationSource;
  /** 1-based index of the listed pronunciation used (0 when not from the dictionary). */
  variant: number;
  variants: string[][];
  /** How an estimate was made, or which override applied, in words. */
  how: string;
  /**
   * True when a requested variant is not listed (see `variants`): the first listed pronunciation,
   * or the estimate for a word the dictionary does not hold, was used instead.
   */
  variantMissed: boolean;
  /** The estimator's ranked candidates with scores, when it made the estimate; else empty. */
  alternatives: Candidate[];
}

/** Everything about a word that does not depend on where it stands; computed once per spelling. */
export interface WordScore extends Pronunciation, WordFigures {}

export function countSyllables(phones: string[]): number {
  let n = 0;
  for (const p of phones) if (isVowel(p)) n++;
  return n;
}

export class Pronouncer {
  private readonly overrides = new Map<string, Override>();
  private readonly cache = new Map<string, WordScore>();

  constructor(
    private readonly data: WordData,
    overrides: Override[],
    private readonly wcmOptions: WcmOptions,
  ) {
    // Later overrides win: callers pass the workspace lexicon first, then the script's own.
    for (const o of overrides) this.overrides.set(o.word, o);
  }

  /** The override of a spoken word; one written without the diaeresis ("@say Anais") also applies to "Anaïs". */
  override(word: string): Override | undefined {
    return this.overrides.get(word) ?? this.overrides.get(plainSpelling(word));
  }

  /** Scores a lower-case spoken word, optionally choosing a listed variant (1-based). */
  score(spoken: string, variant: number | null = null): WordScore {
    const key = variant ? `${spoken}(${variant})` : spoken;
    let hit = this.cache.get(key);
    if (!hit) {
      hit = this.compute(spoken, variant);
      this.cache.set(key, hit);
    }
    return hit;
  }

  private compute(spoken: string, variant: number | null): WordScore {
    const p = this.pronounce(spoken, variant);
    // A word with a diaeresis between two vowels is counted by its plain spelling when it is that
    // listed word ("naïve" is "naive"), not when it was told apart from it ("Gaël" is not "Gael",
    // G EY1 L: unseen).
    const plain = plainSpelling(spoken);
    const count = plain === spoken || this.listed(spoken).length > 0 ? this.frequencyCount(plain) : 0;
    return {
      ...p,
      syllables: countSyllables(p.phones),
      phonemes: p.phones.length,
      wcm: wordComplexity(p.phones, this.wcmOptions),
      count,
      zipf: zipf(count),
      lg10wf: lg10wf(count),
    };
  }

  /**
   * SUBTLEX-US counts word forms as its corpus was tokenised: at apostrophes, so "don't" is
   * counted as "don" + "t" and "John's" as "john" + "s". A word with an apostrophe that is not
   * listed whole takes the smallest count among its parts (the stem's, since the clitic parts
   * "t", "s", "ll" are counted from every contraction); 0 when a part is unseen.
   */
  private frequencyCount(spoken: string): number {
    const c = this.data.count(spoken);
    if (c > 0 || !spoken.includes("'")) return c;
    const parts = spoken.split("'").filter(Boolean);
    let min = Infinity;
    for (const part of parts) min = Math.min(min, this.data.count(part));
    return parts.length && Number.isFinite(min) ? min : 0;
  }

  /**
   * The dictionary's pronunciations of a spoken word. A word with vowels marked to be said apart
   * ("Thaïs", core/hiatus.ts) is looked up by its plain spelling and keeps only the listed
   * pronunciations that say them apart (numbered among themselves): "thais" is listed as T AY1 Z,
   * one syllable, so "Thaïs" is estimated instead. Without a model to align them, all are kept.
   */
  listed(spoken: string): string[][] {
    const hiatus = hiatusOf(spoken);
    const listed = this.data.pronunciations(hiatus?.plain ?? spoken);
    if (!listed) return [];
    const variants = listed.map(parsePhones);
    if (hiatus === null || !this.data.keepsHiatus) return variants;
    return variants.filter((phones) => this.data.keepsHiatus!(hiatus.plain, phones, hiatus.at) !== false);
  }

  pronounce(spoken: string, variant: number | null): Pronunciation {
    const variants = this.listed(spoken);
    const o = this.override(spoken);
    let wanted = variant;
    if (o && o.phones.length && wanted === null) {
      return { phones: o.phones, source: 'override', variant: 0, variants, how: `override (${o.origin})`, variantMissed: false, alternatives: [] };
    }
    if (o && o.variant !== null && wanted === null) wanted = o.variant;
    if (variants.length) {
      const variantMissed = wanted !== null && !(wanted >= 1 && wanted <= variants.length);
      const index = wanted !== null && !variantMissed ? wanted : 1;
      return {
        phones: variants[index - 1],
        source: 'dictionary',
        variant: index,
        variants,
        how: index > 1 ? `listed pronunciation ${index} of ${variants.length}` : 'CMU Pronouncing Dictionary',
        variantMissed,
        alternatives: [],
      };
    }
    const est = estimatePronunciation(spoken, this.data);
    return {
      phones: est.phones,
      source: est.source,
      variant: 0,
      variants: [],
      how: est.how,
      alternatives: est.alternatives,
      variantMissed: wanted !== null,
    };
  }
}

/**
 * Whether a pronunciation was estimated rather than listed or written: letter-to-sound rules, or
 * built from a dictionary stem. Estimated words are marked "≈" and offered as `@say` overrides.
 */
export function isEstimated(w: { source: PronunciationSource }): boolean {
  return w.source === 'estimate' || w.source === 'morphology';
}
