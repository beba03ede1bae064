// The n-gram half of the joint-sequence model: an interpolated, modified Kneser-Ney model over
// graphone sequences (Chen & Goodman 1999, "An empirical study of smoothing techniques for
// language modeling", Computer Speech and Language 13(4), 359-394), pruned by count cut-offs and
// stored in backoff form (an explicit probability for each kept n-gram, a backoff weight for each
// kept context), which gives the same probabilities as the interpolated model for kept n-grams.
//
// Token 0 is the word boundary: the start context <s> and the predicted end </s>.

const key = (ids) => ids.join(' ');

/**
 * Builds the model from sequences of graphone ids (1-based; 0 is reserved for the boundary).
 * `cutoffs[k]` is the least number of occurrences an n-gram of order k+1 needs to be kept
 * (non-decreasing). Returns entries sorted by order, then context, then token:
 * { order, ids, logp (log10), bow (log10, for kept contexts) }.
 */
export function kneserNey(sequences, order, cutoffs) {
  const raw = Array.from({ length: order }, () => new Map());
  for (const seq of sequences) {
    const s = [0, ...seq, 0];
    for (let t = 1; t < s.length; t++) {
      // Keys grow leftwards from the predicted token: "c", "b c", "a b c".
      let g = String(s[t]);
      for (let k = 1; k <= order && t - k + 1 >= 0; k++) {
        if (k > 1) g = `${s[t - k + 1]} ${g}`;
        raw[k - 1].set(g, (raw[k - 1].get(g) ?? 0) + 1);
      }
    }
  }
  raw[0].set('0', raw[0].get('0') ?? 0);
  // Counts used at each order: raw counts at the top order and for n-grams that begin with <s>
  // (they have no left extension), continuation counts (distinct left extensions) elsewhere.
  const adj = raw.map((m, k) => {
    if (k === order - 1) return m;
    const out = new Map();
    for (const g of raw[k + 1].keys()) {
      const suffix = g.slice(g.indexOf(' ') + 1);
      out.set(suffix, (out.get(suffix) ?? 0) + 1);
    }
    for (const [g, c] of m) if (g.startsWith('0 ') || !out.has(g)) out.set(g, c);
    return out;
  });
  const probs = new Map(); // key -> probability (linear)
  const bows = new Map(); // context key -> backoff weight (linear)
  const prob = (ids) => {
    for (let start = 0; ; start++) {
      const p = probs.get(key(ids.slice(start)));
      if (p !== undefined) {
        let w = 1;
        for (let b = 0; b < start; b++) w *= bows.get(key(ids.slice(b, -1))) ?? 1;
        return w * p;
      }
      if (start >= ids.length - 1) throw new Error(`no unigram for ${ids.at(-1)}`);
    }
  };
  // Unigrams: continuation counts, <s> itself never predicted.
  let total = 0;
  for (const [g, c] of adj[0]) if (g !== '0' || c > 0) total += c;
  const vocab = adj[0].size;
  for (const [g, c] of adj[0]) probs.set(g, (c + 1) / (total + vocab));
  for (let k = 2; k <= order; k++) {
    const counts = adj[k - 1];
    const n = [0, 0, 0, 0, 0];
    for (const c of counts.values()) if (c <= 4) n[c]++;
    const y = n[1] / (n[1] + 2 * n[2]);
    const D = [0, 1 - 2 * y * (n[2] / n[1]), 2 - 3 * y * (n[3] / n[2]), 3 - 4 * y * (n[4] / n[3])].map((d) =>
      Number.isFinite(d) && d > 0 ? d : 0.5,
    );
    const disc = (c) => D[Math.min(c, 3)];
    const ctx = new Map(); // context -> { total, gammaMass }
    for (const [g, c] of counts) {
      const h = g.slice(0, g.lastIndexOf(' '));
      const e = ctx.get(h) ?? { total: 0, mass: 0, kept: 0, keptLow: 0 };
      e.total += c;
      e.mass += disc(c);
      ctx.set(h, e);
    }
    const kept = [];
    for (const [g, c] of counts) {
      if (raw[k - 1].get(g) < cutoffs[Math.min(k - 1, cutoffs.length - 1)]) continue;
      const ids = g.split(' ').map(Number);
      const h = g.slice(0, g.lastIndexOf(' '));
      if (!probs.has(h)) continue;
      const e = ctx.get(h);
      const low = prob(ids.slice(1));
      const p = (c - disc(c)) / e.total + (e.mass / e.total) * low;
      e.kept += p;
      e.keptLow += low;
      kept.push([g, p]);
    }
    for (const [g, p] of kept) probs.set(g, p);
    for (const [h, e] of ctx) {
      if (e.kept === 0 || !probs.has(h)) continue;
      bows.set(h, Math.max(1e-9, 1 - e.kept) / Math.max(1e-9, 1 - e.keptLow));
    }
  }
  const out = [];
  for (const [g, p] of probs) {
    const ids = g.split(' ').map(Number);
    const b = bows.get(g);
    out.push({ order: ids.length, ids, logp: Math.log10(p), bow: b === undefined ? null : Math.log10(b) });
  }
  out.sort((a, b) => {
    if (a.order !== b.order) return a.order - b.order;
    for (let i = 0; i < a.order; i++) if (a.ids[i] !== b.ids[i]) return a.ids[i] - b.ids[i];
    return 0;
  });
  return out;
}
