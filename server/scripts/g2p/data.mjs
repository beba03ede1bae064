// The pronunciation estimator's data: CMU Pronouncing Dictionary entries and the fixed split.
//
// The split is by spelling, so every listed variant of a word lands in the same part:
//   held out (test):  FNV-1a 32-bit hash of the lower-case spelling (UTF-8) mod 10 == 0
//   development:      hash mod 10 == 1 (used only to choose parameters, then trained on)
//   training:         everything else
// Only plain spellings (letters a-z and the apostrophe) take part; abbreviations with full stops
// and entries with digits are left out.

/** FNV-1a, 32 bits, over the UTF-8 bytes of a string (offset basis 2166136261, prime 16777619). */
export function fnv1a(text) {
  let h = 0x811c9dc5;
  for (const byte of Buffer.from(text, 'utf8')) {
    h ^= byte;
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h >>> 0;
}

/** 'test', 'dev' or 'train' for a lower-case spelling. */
export function part(word) {
  const r = fnv1a(word) % 10;
  return r === 0 ? 'test' : r === 1 ? 'dev' : 'train';
}

export const SPELLING = /^[a-z']+$/;

/** Word -> listed pronunciations (phone arrays, stress digits kept), in listed order. */
export function entries(dictionary) {
  const byWord = new Map();
  const variant = /^(.*)\((\d+)\)$/;
  const keys = Object.keys(dictionary).map((k) => {
    const m = variant.exec(k);
    return m ? { word: m[1], n: Number(m[2]), k } : { word: k, n: 1, k };
  });
  keys.sort((a, b) => (a.word < b.word ? -1 : a.word > b.word ? 1 : a.n - b.n));
  for (const { word, k } of keys) {
    if (!SPELLING.test(word)) continue;
    const phones = dictionary[k].replace(/#.*$/, '').trim().split(/\s+/).filter(Boolean);
    if (phones.length === 0) continue;
    const list = byWord.get(word) ?? [];
    list.push(phones);
    byWord.set(word, list);
  }
  return byWord;
}
