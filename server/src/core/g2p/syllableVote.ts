// A minimum-Bayes-risk choice of the syllable count over the estimator's ranked proposals.
//
// The single best pronunciation is the choice that minimises the expected loss when only an
// exact match counts; when what matters is the number of syllables (the figure Rungs shows and
// scores with), the choice with the least expected loss is the count with the largest posterior
// mass, summed over all proposals with that count (minimum-Bayes-risk decoding: Kumar & Byrne
// 2004, "Minimum Bayes-risk decoding for statistical machine translation", HLT-NAACL, from
// memory; applied to n-best lists of a joint-sequence model, Bisani & Ney 2008, Speech
// Communication 50(5)). The pronunciation returned is then the best-ranked proposal with that
// count, so the phones stay those of a proposal the models scored.

/** A proposal: its phones (vowels carry a stress digit) and its log10 score. */
export interface Scored {
  phones: string[];
  log10: number;
}

/** Vowels (syllable nuclei) in CMU phones: the phones with a stress digit. */
export function vowelCount(phones: readonly string[]): number {
  let n = 0;
  for (const p of phones) {
    const c = p.charCodeAt(p.length - 1);
    if (c >= 48 && c <= 57) n++;
  }
  return n;
}

/**
 * Index of the proposal to put first: the best-ranked one (lowest index) among those whose vowel
 * count has the largest posterior mass. A count of no vowels takes part only when every proposal
 * has none: of the 135,155 entries of the CMU Pronouncing Dictionary (npm
 * cmu-pronouncing-dictionary@3.0.0) only 8 interjections ("hmm", "shh") have no vowel, while the
 * models read some spellings as consonants alone ("shed" as SH T, "bp" as B P); on the
 * development words this raised syllables exact from 97.28 % to 97.36 %. Posteriors are
 * 10^(log10 / temperature), normalised over the list: a temperature above 1 flattens the scores
 * of the models, which are over-confident as n-gram scores are (chosen on the development words). `proposals` is in ranked order; -1 when
 * it is empty. Ties in mass keep the count of the first proposal.
 */
export function syllableVote(proposals: readonly Scored[], temperature: number): number {
  if (proposals.length === 0) return -1;
  const top = Math.max(...proposals.map((p) => p.log10));
  const mass = new Map<number, number>();
  for (const p of proposals) {
    const n = vowelCount(p.phones);
    mass.set(n, (mass.get(n) ?? 0) + 10 ** ((p.log10 - top) / temperature));
  }
  if (mass.size > 1) mass.delete(0);
  let winner = vowelCount(proposals[0].phones);
  if (!mass.has(winner)) winner = mass.keys().next().value!;
  for (const [n, m] of mass) if (m > mass.get(winner)!) winner = n;
  return proposals.findIndex((p) => vowelCount(p.phones) === winner);
}
