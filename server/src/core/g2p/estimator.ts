// The pronunciation estimator: two joint-sequence models (Bisani & Ney 2008), one reading the
// spelling left to right and one right to left (trained on reversed spellings and phones), so
// that between them every letter is seen with context on both sides. Each proposes its best
// pronunciations; every proposal is then scored by both models (the joint probability of the
// spelling and that exact pronunciation under each), and the proposals are ranked by the sum of
// the two log probabilities, a log-linear combination with equal weights. Proposals with exactly
// one primary stress, as nearly every dictionary word has, rank before the others (on the
// development words this raised primary stress exact from 85 % to 91 % and phones exact by 0.4
// points, for 0.2 points of syllables exact). Last, the syllable count is chosen by the summed
// probability of all proposals with that count (syllableVote.ts), and the best proposal with
// that count is put first.
import { type Candidate, decode } from './decode';
import type { G2pModel } from './model';
import { syllableVote } from './syllableVote';

export interface Estimator {
  forward: G2pModel;
  /** The right-to-left model; without it the forward model answers alone. */
  reverse: G2pModel | null;
}

/** Proposals taken from each model before rescoring, and the beam that finds them (measured on
 * the development words: a wider beam or more proposals changed no answer). */
const PROPOSALS = 4;
const BEAM = 16;
/**
 * Temperature of the syllable vote (syllableVote.ts). On the development words (models trained
 * without them) the vote raised syllables exact from 96.90 % to 97.28 % and phones exact from
 * 74.44 % to 74.52 %; temperatures 1, 2, 4 and 6 gave 97.14, 97.20, 97.31 and 97.28 % syllables
 * with fewer phones right, 10 lost phones (74.14 %).
 */
const TEMPERATURE = 3;

/**
 * Longest spelling the estimator decodes. The longest plain words of the dictionary have about
 * 20 letters; a longer run of letters is not a word the models know how to read, and the search
 * grows with the length, so such input goes to the letter-to-sound rules (linear in the length).
 */
export const MAX_ESTIMATED_LETTERS = 32;

const reversed = <T>(xs: readonly T[]): T[] => [...xs].reverse();

/** Primary stresses (vowels marked 1) in CMU phones: dictionary words nearly always have one. */
export function mainStresses(phones: readonly string[]): number {
  let n = 0;
  for (const p of phones) if (p.endsWith('1')) n++;
  return n;
}

/**
 * Why an alternative ranks below ones with a higher share, for people reading the ranked list:
 * proposals without exactly one main stress rank after those with one, whatever their score.
 */
export function rankNote(phones: readonly string[]): string {
  const n = mainStresses(phones);
  return n === 1 ? '' : n === 0 ? 'no main stress: ranked after readings with one' : `${n} main stresses: ranked after readings with one`;
}

/**
 * log10 probability of one exact pronunciation under a model, -Infinity when it cannot spell it
 * (with `hiatus`, saying the vowels at each hiatus apart: decode.ts).
 */
function scoreOf(m: G2pModel, word: string, phones: string[], hiatus?: readonly number[]): number {
  return decode(m, word, 1, BEAM, phones, true, hiatus)[0]?.log10 ?? -Infinity;
}

/** A hiatus point (before letter b) as seen by the right-to-left model, which reads `word` reversed. */
const mirrored = (hiatus: readonly number[] | undefined, n: number): number[] | undefined => hiatus?.map((b) => n - b);

/**
 * Whether a pronunciation says the vowels at each hiatus of a spelling apart (core/hiatus.ts):
 * some alignment of it with the spelling under the left-to-right model gives the two letters two
 * vowels, or (when the model has no graphone for the alignment the pronunciation needs, as for
 * the dictionary's "israel" IH1 Z R IY0 AH0 L) it has at least as many vowels as the best
 * reading with the vowels apart.
 */
export function keepsHiatus(e: Estimator, word: string, phones: string[], hiatus: readonly number[]): boolean {
  if (scoreOf(e.forward, word, phones, hiatus) > -Infinity) return true;
  const apart = estimateCandidates(e, word, 1, undefined, hiatus)[0];
  return apart !== undefined && vowelCount(phones) >= vowelCount(apart.phones);
}

const vowelCount = (phones: readonly string[]): number => phones.filter((p) => /\d$/.test(p)).length;

/**
 * Weight of a reading built by morphology on dictionary stems (`prior` below), as a log10 bonus
 * on its score: 10 times the models' own probability. Chosen on the development words with each
 * word hidden from the lookup (models trained without them): a bonus of 0, 0.5, 1, 1.5, 2 and 3
 * gave phones exact 74.61, 74.91, 75.07, 75.24, 75.27 and 75.23 % for every analysed word, and,
 * with plurals of listed stems taken as they are (lts/estimate.ts), 1, 1.5, 2 and 3 gave
 * syllables exact 97.35, 97.31, 97.32 and 97.29 %. With 1, the whole fallback (lts/estimate.ts)
 * gives 75.52 % phones and 97.35 % syllables there; taking every analysis as it is gave 70.20 %
 * and 96.83 %.
 */
export const PRIOR_BONUS = 1;

/**
 * Up to `k` ranked pronunciations of a lower-case spelling (empty when the letters are unknown).
 * `prior`, a reading built by morphology, joins the proposals, scored by the models like the
 * others and weighted by PRIOR_BONUS. With `hiatus`, every reading says the vowels at each
 * hiatus apart (core/hiatus.ts).
 */
export function estimateCandidates(e: Estimator, word: string, k: number, prior?: readonly string[], hiatus?: readonly number[]): Candidate[] {
  if (word.length > MAX_ESTIMATED_LETTERS) return [];
  if (e.reverse === null && prior === undefined) return decode(e.forward, word, k, BEAM, undefined, false, hiatus);
  const { forward, reverse } = e;
  const drow = reversed([...word]).join('');
  const wolg = mirrored(hiatus, word.length);
  const proposals = new Map<string, string[]>();
  // One more from the left-to-right model, whatever `k`, so the first answer does not depend on
  // how many alternatives the caller shows (a hover shows five).
  for (const c of decode(forward, word, Math.max(k, PROPOSALS + 1), BEAM, undefined, false, hiatus)) proposals.set(c.phones.join(' '), c.phones);
  if (reverse !== null) {
    for (const c of decode(reverse, drow, PROPOSALS, BEAM, undefined, false, wolg)) {
      const phones = reversed(c.phones);
      proposals.set(phones.join(' '), phones);
    }
  }
  const priorKey = prior?.join(' ');
  if (prior !== undefined) proposals.set(priorKey!, [...prior]);
  const scored: { phones: string[]; log10: number }[] = [];
  for (const [key, phones] of proposals) {
    let log10 = scoreOf(forward, word, phones, hiatus) + (reverse === null ? 0 : scoreOf(reverse, drow, reversed(phones), wolg));
    if (key === priorKey) log10 += PRIOR_BONUS;
    if (log10 > -Infinity) scored.push({ phones, log10 });
  }
  const wellFormed = (phones: string[]): number => (mainStresses(phones) === 1 ? 1 : 0);
  scored.sort((a, b) => wellFormed(b.phones) - wellFormed(a.phones) || b.log10 - a.log10);
  const chosen = syllableVote(scored, TEMPERATURE);
  if (chosen > 0) scored.unshift(...scored.splice(chosen, 1));
  const top = scored.slice(0, k);
  const best = Math.max(...top.map((c) => c.log10));
  const total = top.reduce((t, c) => t + 10 ** (c.log10 - best), 0);
  return top.map((c) => ({ ...c, share: 10 ** (c.log10 - best) / total }));
}
