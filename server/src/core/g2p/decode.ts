// Beam-search decoding of a spelling with the joint-sequence model (model.ts): hypotheses walk
// the letters left to right, each step taking one graphone of one or two letters. Hypotheses at
// the same letter in the same model state are recombined (the better one is kept, as in Viterbi
// decoding), and only the best `beam` are kept at each letter. At the end the word-boundary
// probability is added, and hypotheses that spell the same phones are added together (different
// alignments of one pronunciation) before the distinct pronunciations are ranked.
import { type G2pModel, step, stepResult } from './model';

export interface Candidate {
  /** CMU ARPAbet phones with stress digits. */
  phones: string[];
  /** log10 of the joint probability of spelling and pronunciation, summed over alignments kept. */
  log10: number;
  /** Share of the probability among the returned candidates (0-1). */
  share: number;
}

interface Hyp {
  state: number;
  score: number;
  /** Phones of the target consumed so far (decoding towards a target). */
  pos: number;
  token: number;
  prev: Hyp | null;
}

const LN10 = Math.log(10);
/** log10(10^a + 10^b) without overflow. */
function addLog(a: number, b: number): number {
  if (a === -Infinity) return b;
  if (b === -Infinity) return a;
  const hi = Math.max(a, b);
  return hi + Math.log1p(Math.exp((Math.min(a, b) - hi) * LN10)) / LN10;
}

/** Hypotheses kept per letter; measured on the development words, more gains nothing. */
export const DEFAULT_BEAM = 40;
/** log10 distance below the best hypothesis at a letter beyond which candidates are dropped. */
const PRUNE = 4;

function phonesOf(m: G2pModel, h: Hyp): string {
  const parts: string[] = [];
  for (let at: Hyp | null = h; at !== null && at.prev !== null; at = at.prev) {
    const text = m.graphones[at.token]!.text;
    if (text !== '') parts.push(text);
  }
  return parts.reverse().join(' ');
}

/** Whether graphone `t` spells target[pos...] (once stress is removed, unless `exact`). */
function fits(m: G2pModel, t: number, target: string[], pos: number, exact: boolean): boolean {
  const bare = exact ? m.graphones[t]!.phones : m.graphones[t]!.bare;
  if (pos + bare.length > target.length) return false;
  for (let j = 0; j < bare.length; j++) if (bare[j] !== target[pos + j]) return false;
  return true;
}

/**
 * Up to `k` pronunciations of a lower-case spelling, best first. Empty when the model has no
 * graphone for some letter (a letter outside a-z and the apostrophe, for example). With a
 * `target` (phones without stress digits), only pronunciations that are the target once stress
 * is removed are searched: that is how stress is put on a given phone sequence.
 */
export function decode(m: G2pModel, word: string, k = 5, beam = DEFAULT_BEAM, target?: string[], exact = false): Candidate[] {
  const n = word.length;
  if (n === 0) return [];
  const at: Map<number, Hyp>[] = Array.from({ length: n + 1 }, () => new Map());
  at[0].set(0, { state: m.start, score: 0, pos: 0, token: 0, prev: null });
  for (let i = 0; i < n; i++) {
    if (at[i].size === 0) continue;
    const hyps = [...at[i].values()].sort((a, b) => b.score - a.score).slice(0, beam);
    for (let len = 1; len <= 2 && i + len <= n; len++) {
      const tokens = m.byLetters.get(word.slice(i, i + len));
      if (tokens === undefined) continue;
      const bucket = at[i + len];
      let best = -Infinity;
      for (const b of bucket.values()) best = Math.max(best, b.score);
      for (const h of hyps) {
        for (const t of tokens) {
          if (target !== undefined && !fits(m, t, target, h.pos, exact)) continue;
          step(m, h.state, t);
          const score = h.score + stepResult.cost;
          // Far below the best so far at this letter: it could not enter the beam.
          if (score < best - PRUNE) continue;
          if (score > best) best = score;
          const state = stepResult.state;
          const pos = target === undefined ? 0 : h.pos + m.graphones[t]!.bare.length;
          const key = target === undefined ? state : state * 64 + pos;
          const old = bucket.get(key);
          if (old === undefined) bucket.set(key, { state, score, pos, token: t, prev: h });
          else if (score > old.score) Object.assign(old, { score, token: t, prev: h });
        }
      }
    }
  }
  const totals = new Map<string, number>();
  for (const h of at[n].values()) {
    if (target !== undefined && h.pos !== target.length) continue;
    step(m, h.state, 0);
    const phones = phonesOf(m, h);
    if (stepResult.cost === -Infinity || phones === '') continue;
    totals.set(phones, addLog(totals.get(phones) ?? -Infinity, h.score + stepResult.cost));
  }
  const ranked = [...totals.entries()].sort((a, b) => b[1] - a[1]).slice(0, k);
  let sum = -Infinity;
  for (const [, s] of ranked) sum = addLog(sum, s);
  return ranked.map(([phones, s]) => ({ phones: phones.split(' '), log10: s, share: 10 ** (s - sum) }));
}
