// The pronunciation estimator's model: a joint-sequence (graphone) n-gram model (Bisani & Ney
// 2008, "Joint-sequence models for grapheme-to-phoneme conversion", Speech Communication 50(5),
// 434-451), trained on the CMU Pronouncing Dictionary by server/scripts/train-pronounce.mjs.
// This file reads the model text (the format is described in server/scripts/g2p/model-file.mjs)
// into flat arrays, and scores one graphone given a state: the backoff n-gram model is walked
// as an automaton, so a step costs one or two table look-ups.

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
}

export interface G2pModel {
  header: ModelHeader;
  /** Token i (1-based graphones; 0 is the word boundary). */
  graphones: (Graphone | null)[];
  /** Tokens by their letters (one or two), for the decoder. */
  byLetters: Map<string, number[]>;
  tokens: number;
  /** (context entry, token) -> entry; context -1 is the empty context. */
  table: PairTable;
  logp: Float32Array;
  bow: Float32Array;
  /** Entry of the same n-gram without its oldest token, -1 for unigrams. */
  backoff: Int32Array;
  /** State after this n-gram: the longest suffix of it that is a context (-1: none). */
  next: Int32Array;
  /** State at the start of a word: the context <s>. */
  start: number;
}

/**
 * An open-addressing hash table from (context, token) pairs to entries. A Map keyed by
 * context * tokens + token would need keys beyond the small-integer range, which makes every
 * look-up several times slower; this keeps look-ups to a multiply and a probe or two.
 */
export class PairTable {
  private readonly mask: number;
  private readonly ctx: Int32Array;
  private readonly tok: Int32Array;
  private readonly val: Int32Array;

  constructor(capacity: number) {
    let size = 1024;
    while (size < capacity * 2) size *= 2;
    this.mask = size - 1;
    this.ctx = new Int32Array(size);
    this.tok = new Int32Array(size).fill(-1);
    this.val = new Int32Array(size);
  }

  private slot(ctx: number, tok: number): number {
    return (Math.imul(ctx + 1, 0x9e3779b1) ^ Math.imul(tok, 0x85ebca6b)) & this.mask;
  }

  set(ctx: number, tok: number, value: number): void {
    let i = this.slot(ctx, tok);
    while (this.tok[i] !== -1 && (this.tok[i] !== tok || this.ctx[i] !== ctx)) i = (i + 1) & this.mask;
    this.ctx[i] = ctx;
    this.tok[i] = tok;
    this.val[i] = value;
  }

  /** The entry, or -1 when absent. */
  get(ctx: number, tok: number): number {
    let i = this.slot(ctx, tok);
    for (;;) {
      const t = this.tok[i];
      if (t === -1) return -1;
      if (t === tok && this.ctx[i] === ctx) return this.val[i];
      i = (i + 1) & this.mask;
    }
  }
}

/** Parses a model file: its models in order (each starts with a JSON header line). */
export function parseModels(text: string): G2pModel[] {
  const models: G2pModel[] = [];
  let start = 0;
  while (start < text.length) {
    const next = text.indexOf('\n{', start);
    const end = next < 0 ? text.length : next + 1;
    models.push(parseModel(text.slice(start, end)));
    start = end;
  }
  return models;
}

/** Parses one model's text; throws on a malformed file (the caller reports it once). */
export function parseModel(text: string): G2pModel {
  const firstBreak = text.indexOf('\n');
  const header = JSON.parse(text.slice(0, firstBreak)) as ModelHeader;
  if (header.format !== 1) throw new Error(`pronunciation model format ${header.format} is not supported`);
  const graphones: (Graphone | null)[] = [null];
  const byLetters = new Map<string, number[]>();
  header.graphones.forEach((key, i) => {
    const cut = key.indexOf('}');
    const phones = key.slice(cut + 1).split('_').filter(Boolean);
    const g = { letters: key.slice(0, cut), phones, text: phones.join(' '), bare: phones.map((p) => p.replace(/\d$/, '')) };
    graphones.push(g);
    const list = byLetters.get(g.letters) ?? [];
    list.push(i + 1);
    byLetters.set(g.letters, list);
  });
  const tokens = graphones.length;
  const scale = header.scale;
  if (!(scale > 0)) throw new Error('pronunciation model has no scale');
  // A hand-written scan of the integer fields: splitting 400,000 lines into strings costs
  // several times more, and this runs on the first estimate of a session.
  let n = 0;
  for (let q = firstBreak + 1; q < text.length; q++) if (text.charCodeAt(q) === 10) n++;
  const logp = new Float32Array(n);
  const bow = new Float32Array(n);
  const backoff = new Int32Array(n);
  const next = new Int32Array(n);
  const table = new PairTable(n);
  const fields = [0, 0, 0, 0];
  let p = firstBreak + 1;
  let ctx = -1;
  for (let i = 0; i < n; i++) {
    let count = 0;
    while (count < 4) {
      let sign = 1;
      if (text.charCodeAt(p) === 45) {
        sign = -1;
        p++;
      }
      let v = 0;
      let c = text.charCodeAt(p);
      if (c < 48 || c > 57) throw new Error(`pronunciation model line ${i + 2}: not a number`);
      while (c >= 48 && c <= 57) {
        v = v * 10 + c - 48;
        c = text.charCodeAt(++p);
      }
      fields[count++] = sign * v;
      p++;
      if (c === 10) break;
    }
    if (count < 3) throw new Error(`pronunciation model line ${i + 2}: too few fields`);
    ctx += fields[0];
    const w = fields[1];
    logp[i] = fields[2] / scale;
    const isContext = count > 3;
    if (isContext) bow[i] = fields[3] / scale;
    table.set(ctx, w, i);
    if (ctx < 0) backoff[i] = -1;
    else {
      const b = table.get(backoff[ctx], w);
      if (b < 0) throw new Error(`pronunciation model line ${i + 2}: missing lower-order n-gram`);
      backoff[i] = b;
    }
    next[i] = isContext ? i : backoff[i] < 0 ? -1 : next[backoff[i]];
  }
  const start = table.get(-1, 0);
  if (start < 0) throw new Error('pronunciation model has no word-start context');
  return { header, graphones, byLetters, tokens, table, logp, bow, backoff, next, start };
}

/** The result of the last `step` (kept in one object so the hot loop allocates nothing). */
export const stepResult = { cost: 0, state: -1 };

/** log10 P(token | state) and the next state, into `stepResult`; cost -Infinity when unknown. */
export function step(m: G2pModel, state: number, token: number): void {
  let s = state;
  let cost = 0;
  for (;;) {
    const e = m.table.get(s, token);
    if (e >= 0) {
      stepResult.cost = cost + m.logp[e];
      stepResult.state = m.next[e];
      return;
    }
    if (s < 0) {
      stepResult.cost = -Infinity;
      stepResult.state = -1;
      return;
    }
    cost += m.bow[s];
    s = m.backoff[s];
  }
}
