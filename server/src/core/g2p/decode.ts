// Beam-search decoding of a spelling with the joint-sequence model (model.ts): hypotheses walk
// the letters left to right, each step taking one graphone of one or two letters. Hypotheses at
// the same letter in the same model state are recombined (the better one is kept, as in Viterbi
// decoding), and only the best `beam` are kept at each letter. At the end the word-boundary
// probability is added, and hypotheses that spell the same phones are added together (different
// alignments of one pronunciation) before the distinct pronunciations are ranked.
//
// This runs for every unknown word of every script, so the search allocates nothing per
// hypothesis: hypotheses live in typed arrays reused from call to call (a backpointer is an
// index), the hypotheses reaching a letter are recombined through a small open-addressing table
// cleared by a stamp, and the best `beam` of a letter are picked by insertion into a short
// sorted list instead of sorting them all.
import { expand, expansion, type G2pModel, step, stepResult } from './model';

export interface Candidate {
  /** CMU ARPAbet phones with stress digits. */
  phones: string[];
  /** log10 of the joint probability of spelling and pronunciation, summed over alignments kept. */
  log10: number;
  /** Share of the probability among the returned candidates (0-1). */
  share: number;
}

const LN10 = Math.log(10);
/** log10(10^a + 10^b) without overflow. */
export function addLog(a: number, b: number): number {
  if (a === -Infinity) return b;
  if (b === -Infinity) return a;
  const hi = Math.max(a, b);
  return hi + Math.log1p(Math.exp((Math.min(a, b) - hi) * LN10)) / LN10;
}

/** Hypotheses kept per letter; measured on the development words, more gains nothing. */
export const DEFAULT_BEAM = 40;
/** log10 distance below the best hypothesis at a letter beyond which candidates are dropped. */
const PRUNE = 4;
/**
 * log10 distance below the best hypothesis at a letter beyond which a hypothesis is not
 * expanded even when the beam has room: on the development words 3 gave the same answers as no
 * limit (0.05 points more phones exact) in 15 % less time; 2 lost 0.8 points.
 */
const EXPAND = 3;
let expandWithin = 0;

/** Hypothesis store: parallel arrays, index = hypothesis; grown by doubling, kept between calls. */
let cap = 0;
let hState = new Int32Array(0);
let hPos = new Int32Array(0);
let hTok = new Int32Array(0);
let hPrev = new Int32Array(0);
let hScore = new Float64Array(0);
let used = 0;

function grow(): void {
  cap = Math.max(4096, cap * 2);
  const copy = <T extends Int32Array | Float64Array>(a: T, b: T): T => (b.set(a), b);
  hState = copy(hState, new Int32Array(cap));
  hPos = copy(hPos, new Int32Array(cap));
  hTok = copy(hTok, new Int32Array(cap));
  hPrev = copy(hPrev, new Int32Array(cap));
  hScore = copy(hScore, new Float64Array(cap));
}

function newHyp(state: number, pos: number, token: number, prev: number, score: number): number {
  if (used === cap) grow();
  hState[used] = state;
  hPos[used] = pos;
  hTok[used] = token;
  hPrev[used] = prev;
  hScore[used] = score;
  return used++;
}

/**
 * The hypotheses reaching one letter, recombined by key (the model state, and with a target the
 * phones consumed): an open-addressing table from key to hypothesis, plus the members in order
 * of arrival. Two of them take turns, since a graphone reads at most two letters.
 */
class Bucket {
  private mask = 1023;
  /** 32 - log2(table size): the hash takes the top bits of a multiplicative hash. */
  private shift = 22;
  private keys = new Int32Array(1024);
  private vals = new Int32Array(1024);
  private stamps = new Int32Array(1024);
  private stamp = 1;
  members = new Int32Array(256);
  size = 0;
  /** The best score among the members (-Infinity when empty). */
  best = -Infinity;
  /** Whether keys are (state, phones consumed), as in a search with a target, or the state alone. */
  private byTarget = false;

  open(byTarget: boolean): void {
    this.byTarget = byTarget;
    this.size = 0;
    this.best = -Infinity;
    if (++this.stamp === 0x7fffffff) {
      this.stamps.fill(0);
      this.stamp = 1;
    }
  }

  /** Adds a hypothesis, or improves the one with the same key; ignores a worse one. */
  offer(key: number, state: number, pos: number, token: number, prev: number, score: number): void {
    if (score > this.best) this.best = score;
    let i = Math.imul(key, 0x9e3779b1) >>> this.shift;
    for (;;) {
      if (this.stamps[i] !== this.stamp) break;
      if (this.keys[i] === key) {
        const h = this.vals[i];
        if (score > hScore[h]) {
          hScore[h] = score;
          hTok[h] = token;
          hPrev[h] = prev;
        }
        return;
      }
      i = (i + 1) & this.mask;
    }
    const h = newHyp(state, pos, token, prev, score);
    this.stamps[i] = this.stamp;
    this.keys[i] = key;
    this.vals[i] = h;
    if (this.size === this.members.length) {
      const m = new Int32Array(this.size * 2);
      m.set(this.members);
      this.members = m;
    }
    this.members[this.size++] = h;
    if (this.size * 2 > this.mask) this.rehash();
  }

  private rehash(): void {
    const size = (this.mask + 1) * 2;
    this.mask = size - 1;
    this.shift--;
    this.keys = new Int32Array(size);
    this.vals = new Int32Array(size);
    this.stamps = new Int32Array(size);
    this.stamp = 1;
    for (let k = 0; k < this.size; k++) {
      const h = this.members[k];
      const key = this.byTarget ? hState[h] * 64 + hPos[h] : hState[h];
      let i = Math.imul(key, 0x9e3779b1) >>> this.shift;
      while (this.stamps[i] === this.stamp) i = (i + 1) & this.mask;
      this.stamps[i] = this.stamp;
      this.keys[i] = key;
      this.vals[i] = h;
    }
  }
}

const buckets = [new Bucket(), new Bucket()];
/** The hypotheses kept at a letter, best first. */
let kept = new Int32Array(64);

/** The best `beam` members of a bucket into `kept`, best first (earlier first among equals). */
function selectBeam(b: Bucket, beam: number): number {
  if (kept.length < beam) kept = new Int32Array(beam);
  let n = 0;
  const floor = b.best - expandWithin;
  for (let k = 0; k < b.size; k++) {
    const h = b.members[k];
    const s = hScore[h];
    if (s < floor) continue;
    if (n === beam && s <= hScore[kept[n - 1]]) continue;
    let j = n < beam ? n++ : n - 1;
    while (j > 0 && hScore[kept[j - 1]] < s) {
      kept[j] = kept[j - 1];
      j--;
    }
    kept[j] = h;
  }
  return n;
}

function phonesOf(m: G2pModel, h: number): string {
  const parts: string[] = [];
  for (let at = h; hPrev[at] >= 0; at = hPrev[at]) {
    const text = m.graphones[hTok[at]]!.text;
    if (text !== '') parts.push(text);
  }
  return parts.reverse().join(' ');
}

/** Per model, the vowel phones (those with a stress digit) of each graphone, for `hiatus`. */
const vowelCounts = new WeakMap<G2pModel, Uint8Array>();

function vowelsOf(m: G2pModel): Uint8Array {
  let counts = vowelCounts.get(m);
  if (counts === undefined) {
    counts = new Uint8Array(m.graphones.length);
    m.graphones.forEach((g, t) => {
      for (const p of g?.phones ?? []) if (/\d$/.test(p)) counts![t]++;
    });
    vowelCounts.set(m, counts);
  }
  return counts;
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
 * is removed are searched: that is how stress is put on a given phone sequence. With `hiatus`
 * (indices of the letters before which two vowels are said apart, core/hiatus.ts), the two
 * letters say two vowels: a graphone reading both of them says two, or the graphones either side
 * of the point each say one.
 */
export function decode(m: G2pModel, word: string, k = 5, beam = DEFAULT_BEAM, target?: string[], exact = false, hiatus?: readonly number[]): Candidate[] {
  const n = word.length;
  if (n === 0) return [];
  // marks[b] = 1: a hiatus lies between letters b - 1 and b.
  let marks: Uint8Array | null = null;
  if (hiatus?.length) {
    marks = new Uint8Array(n + 1);
    for (const b of hiatus) if (b > 0 && b < n) marks[b] = 1;
  }
  const vowels = marks === null ? null : vowelsOf(m);
  used = 0;
  const twoLetters = m.maxLetters > 1;
  // Scores are in the model's units (log10 x scale), so they are sums of integers.
  const prune = PRUNE * m.scale;
  expandWithin = EXPAND * m.scale;
  let current = buckets[0];
  const byTarget = target !== undefined;
  current.open(byTarget);
  current.offer(byTarget ? m.start * 64 : m.start, m.start, 0, 0, -1, 0);
  buckets[1].open(byTarget);
  for (let i = 0; i < n; i++) {
    current = buckets[i & 1];
    const count = current.size === 0 ? 0 : selectBeam(current, beam);
    // This bucket's table now serves the letter after next.
    current.open(byTarget);
    if (count === 0) continue;
    for (let len = 1; len <= 2 && i + len <= n; len++) {
      if (len === 2 && !twoLetters) break;
      // Vowels the graphone must say: two when it reads both letters of a hiatus, one when it
      // ends or starts at one.
      let needVowels = 0;
      if (marks !== null) {
        if (len === 2 && marks[i + 1]) needVowels = 2;
        else if (marks[i] === 1 || marks[i + len] === 1) needVowels = 1;
      }
      const range = m.byLetters.get(len === 1 ? word[i] : word.slice(i, i + 2));
      if (range === undefined) continue;
      const { lo, hi } = range;
      const bucket = buckets[(i + len) & 1];
      for (let q = 0; q < count; q++) {
        const h = kept[q];
        const base = hScore[h];
        const pos = hPos[h];
        expand(m, hState[h], lo, hi);
        const { cost, state: after } = expansion;
        for (let t = lo; t < hi; t++) {
          if (needVowels > 0 && vowels![t] < needVowels) continue;
          const score = base + cost[t - lo];
          // Far below the best so far at this letter: it could not enter the beam.
          if (score < bucket.best - prune) continue;
          const state = after[t - lo];
          if (target === undefined) bucket.offer(state, state, 0, t, h, score);
          else if (fits(m, t, target, pos, exact)) {
            const to = pos + m.graphones[t]!.bare.length;
            bucket.offer(state * 64 + to, state, to, t, h, score);
          }
        }
      }
    }
  }
  const last = buckets[n & 1];
  const totals = new Map<string, number>();
  for (let q = 0; q < last.size; q++) {
    const h = last.members[q];
    if (target !== undefined && hPos[h] !== target.length) continue;
    step(m, hState[h], 0);
    const phones = phonesOf(m, h);
    if (phones === '') continue;
    totals.set(phones, addLog(totals.get(phones) ?? -Infinity, (hScore[h] + stepResult.cost) / m.scale));
  }
  const ranked = [...totals.entries()].sort((a, b) => b[1] - a[1]).slice(0, k);
  let sum = -Infinity;
  for (const [, s] of ranked) sum = addLog(sum, s);
  return ranked.map(([phones, s]) => ({ phones: phones.split(' '), log10: s, share: 10 ** (s - sum) }));
}
