// The pronunciation estimator's model: a joint-sequence (graphone) n-gram model (Bisani & Ney
// 2008, "Joint-sequence models for grapheme-to-phoneme conversion", Speech Communication 50(5),
// 434-451), trained on the CMU Pronouncing Dictionary by server/scripts/train-pronounce.mjs.
// This file reads the model file's bytes (the format is described in
// server/scripts/g2p/model-file.mjs) into a few flat typed arrays, and scores graphones given a
// state: the backoff n-gram model is walked as an automaton.
//
// Layout: the file lists n-grams by order, then context, then token, so the n-grams extending
// one context are a run of consecutive entries sorted by token, and (format 2) the graphones of
// one letter have consecutive numbers. An entry keeps its token, its log probability and backoff
// weight as scaled integers (16 bits each), the entry of its lower-order n-gram and the state
// after it (32 bits each); the runs are found through one offset per entry. That is 18 bytes an
// entry, about 13 MB for a model of 700,000 n-grams, with no hash table: a look-up is a binary
// search in a short run, and the decoder reads all graphones of a letter after a state at once.

export interface Graphone {
  letters: string;
  phones: string[];
  /** The phones joined by spaces. */
  text: string;
  /** The phones without stress digits. */
  bare: string[];
}

export interface ModelHeader {
  format: number;
  method: string;
  /** 'forward' (left to right) or 'reverse' (trained on reversed spellings and phones). */
  direction: string;
  /** Stored log probabilities are log10 x scale, rounded. */
  scale: number;
  params: Record<string, unknown>;
  checksum: string;
  graphones: string[];
  /** How many n-gram lines follow the header. */
  entries: number;
}

export interface G2pModel {
  header: ModelHeader;
  /** Token i (1-based graphones; 0 is the word boundary). */
  graphones: (Graphone | null)[];
  /** The tokens reading these letters (one or two): numbers lo to hi - 1. */
  byLetters: Map<string, { lo: number; hi: number }>;
  tokens: number;
  /** The most letters any graphone reads. */
  maxLetters: number;
  /** Log probabilities are log10 x scale; scores inside the decoder stay in these units. */
  scale: number;
  /** Per entry: the last token of its n-gram. */
  tok: Uint16Array;
  /** Per entry: log10 P(token | context) x scale. */
  logp: Int16Array;
  /** Per entry that is a context: log10 backoff weight x scale (0 otherwise). */
  bow: Int16Array;
  /** Entry of the same n-gram without its oldest token, -1 for unigrams. */
  backoff: Int32Array;
  /** State after this n-gram: the longest suffix of it that is a context (-1: none). */
  next: Int32Array;
  /** The entries extending entry s by one token are firstChild[s] .. firstChild[s + 1] - 1. */
  firstChild: Int32Array;
  /** State at the start of a word: the context <s>. */
  start: number;
}

const NEWLINE = 10;
const BRACE = 123;

/** Parses a model file's bytes (UTF-8): its models in order (each starts with a JSON header line). */
export function parseModels(bytes: Uint8Array): G2pModel[] {
  const models: G2pModel[] = [];
  for (let start = 0; start < bytes.length; ) {
    const { model, end } = parseModelAt(bytes, start);
    models.push(model);
    start = end;
  }
  return models;
}

function readHeader(bytes: Uint8Array, end: number): ModelHeader {
  return checkHeader(JSON.parse(new TextDecoder().decode(bytes.subarray(0, end))) as ModelHeader);
}

/** A model header as read, or an error naming what is wrong with it. */
export function checkHeader(header: ModelHeader): ModelHeader {
  if (typeof header !== 'object' || header === null) throw new Error('pronunciation model header is not an object');
  if (header.format !== 2) throw new Error(`pronunciation model format ${header.format} is not supported`);
  if (!(header.scale > 0)) throw new Error('pronunciation model has no scale');
  if (!Array.isArray(header.graphones) || !header.graphones.every((g) => typeof g === 'string' && g.includes('}'))) {
    throw new Error('pronunciation model header: graphones is not a list of letters}phones');
  }
  return header;
}

/** The graphone list of a checked header, and the token range of each letter string. */
export function readGraphones(header: ModelHeader): Pick<G2pModel, 'graphones' | 'byLetters' | 'maxLetters'> {
  const graphones: (Graphone | null)[] = [null];
  const byLetters = new Map<string, { lo: number; hi: number }>();
  let maxLetters = 1;
  header.graphones.forEach((key, i) => {
    const cut = key.indexOf('}');
    const phones = key.slice(cut + 1).split('_').filter(Boolean);
    const g = { letters: key.slice(0, cut), phones, text: phones.join(' '), bare: phones.map((p) => p.replace(/\d$/, '')) };
    graphones.push(g);
    const range = byLetters.get(g.letters);
    if (range === undefined) byLetters.set(g.letters, { lo: i + 1, hi: i + 2 });
    else if (range.hi === i + 1) range.hi++;
    else throw new Error(`pronunciation model: the graphones of '${g.letters}' are not consecutive`);
    maxLetters = Math.max(maxLetters, g.letters.length);
  });
  return { graphones, byLetters, maxLetters };
}

/**
 * Parses the model whose header line starts at `start` (throws on a malformed file; the caller
 * reports it once), and says where it ends. The header states the number of entries, so the
 * arrays are allocated once and the entries read in one pass.
 */
function parseModelAt(all: Uint8Array, start: number): { model: G2pModel; end: number } {
  const headerEnd = all.indexOf(NEWLINE, start);
  if (headerEnd < 0) throw new Error('pronunciation model has no header line');
  const header = readHeader(all.subarray(start, headerEnd), headerEnd - start);
  const n = header.entries;
  if (!(Number.isInteger(n) && n >= 0)) throw new Error('pronunciation model: entries is not a count');
  const bytes = all.subarray(start);
  const firstBreak = headerEnd - start;
  const { graphones, byLetters, maxLetters } = readGraphones(header);
  const tokens = graphones.length;
  const tok = new Uint16Array(n);
  const logp = new Int16Array(n);
  const bow = new Int16Array(n);
  const backoff = new Int32Array(n);
  const next = new Int32Array(n);
  const firstChild = new Int32Array(n + 1);
  const m: G2pModel = { header, graphones, byLetters, tokens, maxLetters, scale: header.scale, tok, logp, bow, backoff, next, firstChild, start: -1 };
  const fields = [0, 0, 0, 0];
  let p = firstBreak + 1;
  let ctx = -1;
  let filled = 0;
  for (let i = 0; i < n; i++) {
    if (p >= bytes.length) throw new Error(`pronunciation model: ${n} entries stated, ${i} found`);
    let count = 0;
    // A hand-written scan of the integer fields: no string is made for any line.
    while (count < 4) {
      let sign = 1;
      if (bytes[p] === 45) {
        sign = -1;
        p++;
      }
      let v = 0;
      let c = bytes[p];
      if (!(c >= 48 && c <= 57)) throw new Error(`pronunciation model line ${i + 2}: not a number`);
      while (c >= 48 && c <= 57) {
        v = v * 10 + c - 48;
        c = bytes[++p];
      }
      fields[count++] = sign * v;
      p++;
      if (c === NEWLINE) break;
    }
    if (count < 3) throw new Error(`pronunciation model line ${i + 2}: too few fields`);
    const last = ctx;
    ctx += fields[0];
    const w = fields[1];
    if (ctx < last || ctx >= i || w < 0 || w >= tokens) throw new Error(`pronunciation model line ${i + 2}: out of order`);
    tok[i] = w;
    logp[i] = fields[2];
    if (count > 3) bow[i] = fields[3];
    if (ctx < 0) {
      // Unigrams: entry t is token t, for every token.
      if (w !== i) throw new Error(`pronunciation model line ${i + 2}: unigram out of order`);
      backoff[i] = -1;
    } else {
      while (filled <= ctx) firstChild[filled++] = i;
      const b = backoff[ctx] < 0 ? w : find(m, backoff[ctx], w);
      if (b < 0) throw new Error(`pronunciation model line ${i + 2}: missing lower-order n-gram`);
      backoff[i] = b;
    }
    next[i] = count > 3 ? i : backoff[i] < 0 ? -1 : next[backoff[i]];
  }
  while (filled <= n) firstChild[filled++] = n;
  if (n < tokens || tok[tokens - 1] !== tokens - 1) throw new Error('pronunciation model lacks unigrams');
  m.start = 0;
  if (firstChild[1] === firstChild[0] && n > tokens) throw new Error('pronunciation model has no word-start context');
  // After the stated entries: the end of the file or the next model's header line.
  if (p < bytes.length && bytes[p] !== BRACE) throw new Error(`pronunciation model: more than the ${n} entries stated`);
  return { model: m, end: start + Math.min(p, bytes.length) };
}

/** Bytes of a model's n-gram arrays (what it keeps in memory beyond its small graphone list). */
export function modelBytes(m: G2pModel): number {
  return [m.tok, m.logp, m.bow, m.backoff, m.next, m.firstChild].reduce((t, a) => t + a.byteLength, 0);
}

/** The entry extending context `s` by `token`, -1 when the model has none. */
function find(m: G2pModel, s: number, token: number): number {
  let a = m.firstChild[s];
  let b = m.firstChild[s + 1];
  while (a < b) {
    const mid = (a + b) >>> 1;
    const t = m.tok[mid];
    if (t === token) return mid;
    if (t < token) a = mid + 1;
    else b = mid;
  }
  return -1;
}

/** The result of the last `step` (kept in one object so the hot loop allocates nothing). */
export const stepResult = { cost: 0, state: -1 };

/** log10 P(token | state) x scale and the next state, into `stepResult`. */
export function step(m: G2pModel, state: number, token: number): void {
  let cost = 0;
  for (let s = state; s >= 0; s = m.backoff[s]) {
    const e = find(m, s, token);
    if (e >= 0) {
      stepResult.cost = cost + m.logp[e];
      stepResult.state = m.next[e];
      return;
    }
    cost += m.bow[s];
  }
  stepResult.cost = cost + m.logp[token];
  stepResult.state = m.next[token];
}

/** Costs (log10 x scale) and next states of tokens lo .. hi - 1 after `state`, from `expand`. */
export const expansion = { cost: new Int32Array(64), state: new Int32Array(64) };
let seen = new Int32Array(64);
let seenStamp = 0;

/**
 * Scores every token lo .. hi - 1 (the graphones of one letter) after `state` into `expansion`
 * (index token - lo). Walks the backoff chain once: at each context, the run of its successors
 * with tokens in range is found by one binary search, and tokens not yet scored take its values.
 */
export function expand(m: G2pModel, state: number, lo: number, hi: number): void {
  const width = hi - lo;
  if (expansion.cost.length < width) {
    expansion.cost = new Int32Array(width);
    expansion.state = new Int32Array(width);
  }
  if (seen.length < width) seen = new Int32Array(width);
  if (++seenStamp === 0x7fffffff) {
    seen.fill(0);
    seenStamp = 1;
  }
  const { cost: outCost, state: outState } = expansion;
  const { tok, logp, next } = m;
  let left = width;
  let cost = 0;
  for (let s = state; s >= 0 && left > 0; s = m.backoff[s]) {
    let a = m.firstChild[s];
    const end = m.firstChild[s + 1];
    let b = end;
    while (a < b) {
      const mid = (a + b) >>> 1;
      if (tok[mid] < lo) a = mid + 1;
      else b = mid;
    }
    for (let e = a; e < end && tok[e] < hi; e++) {
      const j = tok[e] - lo;
      if (seen[j] === seenStamp) continue;
      seen[j] = seenStamp;
      outCost[j] = cost + logp[e];
      outState[j] = next[e];
      left--;
    }
    cost += m.bow[s];
  }
  if (left === 0) return;
  for (let j = 0; j < width; j++) {
    if (seen[j] === seenStamp) continue;
    outCost[j] = cost + logp[lo + j];
    outState[j] = next[lo + j];
  }
}
