// Letter-to-phone alignment by expectation maximisation, the first stage of a joint-sequence
// (graphone) model (Bisani & Ney 2008, "Joint-sequence models for grapheme-to-phoneme
// conversion", Speech Communication 50(5), 434-451; the align-then-count recipe follows Novak,
// Minematsu & Hirose 2016, "Phonetisaurus", Natural Language Engineering 22(6), 907-938).
//
// A graphone joins letters to phones in one of the given shapes ([letters, phones] pairs, such
// as [1, 0], [1, 1], [1, 2], [2, 1]). Every graphone consumes at least one letter, so a
// decoder can walk the spelling left to right without empty-input loops. EM re-estimates a
// unigram distribution over graphones from the expected counts of all alignments of each
// training pair (forward-backward), then each pair keeps its single best (Viterbi) alignment.


/** Graphone key: letters, '}', phones joined by '_' ("ph}F", "e}", "x}K_S"). */
export const graphoneKey = (letters, phones) => `${letters}}${phones.join('_')}`;

/**
 * Aligns pairs of (spelling, phones). Returns the graphone inventory (keys by id) and, per pair,
 * the graphone ids of its best alignment (null when no alignment exists under the shape limits).
 */
export function align(pairs, SHAPES, iterations, log = () => {}) {
  const ids = new Map();
  const keys = [];
  const intern = (k) => {
    let id = ids.get(k);
    if (id === undefined) {
      id = keys.length;
      ids.set(k, id);
      keys.push(k);
    }
    return id;
  };
  // Edge tables: for each pair, the graphone id of each (letter pos, phone pos, shape), or -1.
  const S = SHAPES.length;
  const edges = pairs.map(([word, phones]) => {
    const m = word.length;
    const n = phones.length;
    const t = new Int32Array((m + 1) * (n + 1) * S).fill(-1);
    for (let i = 0; i < m; i++) {
      for (let j = 0; j <= n; j++) {
        SHAPES.forEach(([a, b], s) => {
          if (i + a > m || j + b > n) return;
          t[(i * (n + 1) + j) * S + s] = intern(graphoneKey(word.slice(i, i + a), phones.slice(j, j + b)));
        });
      }
    }
    return t;
  });
  let prob = new Float64Array(keys.length).fill(1 / keys.length);
  for (let it = 0; it < iterations; it++) {
    const counts = new Float64Array(keys.length);
    let logLik = 0;
    pairs.forEach(([word, phones], w) => {
      const m = word.length;
      const n = phones.length;
      const t = edges[w];
      const W = n + 1;
      const alpha = new Float64Array((m + 1) * W);
      const beta = new Float64Array((m + 1) * W);
      alpha[0] = 1;
      for (let i = 0; i < m; i++) {
        for (let j = 0; j <= n; j++) {
          const a0 = alpha[i * W + j];
          if (a0 === 0) continue;
          for (let s = 0; s < S; s++) {
            const g = t[(i * W + j) * S + s];
            if (g < 0) continue;
            const [a, b] = SHAPES[s];
            alpha[(i + a) * W + j + b] += a0 * prob[g];
          }
        }
      }
      const total = alpha[m * W + n];
      if (total === 0) return;
      logLik += Math.log(total);
      beta[m * W + n] = 1;
      for (let i = m - 1; i >= 0; i--) {
        for (let j = n; j >= 0; j--) {
          let sum = 0;
          for (let s = 0; s < S; s++) {
            const g = t[(i * W + j) * S + s];
            if (g < 0) continue;
            const [a, b] = SHAPES[s];
            const b1 = beta[(i + a) * W + j + b];
            if (b1 === 0) continue;
            sum += prob[g] * b1;
            counts[g] += (alpha[i * W + j] * prob[g] * b1) / total;
          }
          beta[i * W + j] = sum;
        }
      }
    });
    let z = 0;
    for (const c of counts) z += c;
    prob = counts.map((c) => c / z);
    log(`EM iteration ${it + 1}: log-likelihood ${logLik.toFixed(0)}`);
  }
  const paths = pairs.map(([word, phones], w) => viterbi(word.length, phones.length, edges[w], prob, SHAPES));
  return { keys, paths };
}

function viterbi(m, n, t, prob, SHAPES) {
  const S = SHAPES.length;
  const W = n + 1;
  const best = new Float64Array((m + 1) * W).fill(-Infinity);
  const from = new Int32Array((m + 1) * W).fill(-1);
  const via = new Int32Array((m + 1) * W).fill(-1);
  best[0] = 0;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j <= n; j++) {
      const b0 = best[i * W + j];
      if (b0 === -Infinity) continue;
      for (let s = 0; s < S; s++) {
        const g = t[(i * W + j) * S + s];
        if (g < 0 || prob[g] === 0) continue;
        const [a, b] = SHAPES[s];
        const to = (i + a) * W + j + b;
        const score = b0 + Math.log(prob[g]);
        if (score > best[to]) {
          best[to] = score;
          from[to] = i * W + j;
          via[to] = g;
        }
      }
    }
  }
  if (best[m * W + n] === -Infinity) return null;
  const out = [];
  for (let at = m * W + n; at !== 0; at = from[at]) out.push(via[at]);
  return out.reverse();
}
