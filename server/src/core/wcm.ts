// Word Complexity Measure (Stoel-Gammon 2010, Clinical Linguistics & Phonetics 24(4-5), 271-282),
// computed on CMU phones. Eight parameters in three groups (word patterns, syllable structures,
// sound classes); each point marks something harder to say. It is an ordinal count built for
// child phonology, used here to grade adult stimuli, not a validated adult scale.
import { base, isVowel, stressOf, syllableStarts } from './phones';
import type { WcmOptions, WcmParts, WcmResult } from './types';

export const DEFAULT_WCM_OPTIONS: WcmOptions = {
  hAsFricative: false,
  clustersWithinSyllable: false,
  secondaryStressIsInitial: false,
};

const VELARS = new Set(['K', 'G', 'NG']);
const LIQUIDS = new Set(['L', 'R', 'ER']);
const FRICATIVES = new Set(['F', 'V', 'TH', 'DH', 'S', 'Z', 'SH', 'ZH', 'CH', 'JH']);
const VOICED_FRICATIVES = new Set(['V', 'DH', 'Z', 'ZH', 'JH']);

/** Human names of the parameters, in the published order, for hovers and reports. */
export const WCM_PARAMETER_NAMES: Readonly<Record<keyof WcmParts, string>> = {
  syllables: 'more than two syllables',
  nonInitialStress: 'stress not on the first syllable',
  finalConsonant: 'word-final consonant',
  clusters: 'consonant clusters',
  velars: 'velars (k g ŋ)',
  liquids: 'liquids and rhotic vowels (l ɹ ɝ ɚ)',
  fricatives: 'fricatives and affricates',
  voicedFricatives: 'voiced fricatives and affricates',
};

export function emptyWcmParts(): WcmParts {
  return {
    syllables: 0,
    nonInitialStress: 0,
    finalConsonant: 0,
    clusters: 0,
    velars: 0,
    liquids: 0,
    fricatives: 0,
    voicedFricatives: 0,
  };
}

/** Counts runs of two or more consonants; with `withinSyllable`, a run split by a syllable boundary
 *  counts only its parts of length 2+ on each side. */
function countClusters(phones: string[], withinSyllable: boolean): number {
  const starts = withinSyllable ? new Set(syllableStarts(phones)) : null;
  let clusters = 0;
  let run = 0;
  const close = () => {
    if (run >= 2) clusters++;
    run = 0;
  };
  phones.forEach((p, i) => {
    if (isVowel(p)) {
      close();
      return;
    }
    if (starts && starts.has(i) && i > 0) close();
    run++;
  });
  close();
  return clusters;
}

/**
 * WCM of one word's phones. Returns 0 for an empty pronunciation. Range: 0 upward, unbounded
 * (long words with many clusters and fricatives score 10+).
 */
export function wordComplexity(phones: string[], options: WcmOptions = DEFAULT_WCM_OPTIONS): WcmResult {
  const parts = emptyWcmParts();
  if (phones.length === 0) return { total: 0, parts };
  const vowelStress: number[] = [];
  for (const p of phones) {
    if (isVowel(p)) vowelStress.push(stressOf(p));
    const b = base(p);
    if (VELARS.has(b)) parts.velars++;
    if (LIQUIDS.has(b)) parts.liquids++;
    if (FRICATIVES.has(b) || (options.hAsFricative && b === 'HH')) {
      parts.fricatives++;
      if (VOICED_FRICATIVES.has(b)) parts.voicedFricatives++;
    }
  }
  if (vowelStress.length > 2) parts.syllables = 1;
  const primary = vowelStress.indexOf(1);
  const firstStressed = options.secondaryStressIsInitial && vowelStress[0] === 2;
  if (primary > 0 && !firstStressed) parts.nonInitialStress = 1;
  if (!isVowel(phones[phones.length - 1])) parts.finalConsonant = 1;
  parts.clusters = countClusters(phones, options.clustersWithinSyllable);
  let total = 0;
  for (const k of Object.keys(parts) as (keyof WcmParts)[]) total += parts[k];
  return { total, parts };
}

/** Adds one word's parameters into an item's running totals (explicit fields: this is a hot path). */
export function addWcmParts(into: WcmParts, from: WcmParts): void {
  into.syllables += from.syllables;
  into.nonInitialStress += from.nonInitialStress;
  into.finalConsonant += from.finalConsonant;
  into.clusters += from.clusters;
  into.velars += from.velars;
  into.liquids += from.liquids;
  into.fricatives += from.fricatives;
  into.voicedFricatives += from.voicedFricatives;
}
