// Node-side access to the compiled word table (see server/scripts/build-data.mjs). Reading two
// files and binary-searching them costs a few milliseconds, where loading the source packages
// costs hundreds; that is what keeps start-up of the CLI and the server fast.
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import type { Candidate } from '../core/g2p/decode';
import type { WordData } from '../core/types';
import { estimateWith, keepsHiatusWith } from './pronounceModel';

export class WordTable implements WordData {
  private readonly text: string;
  private readonly offsets: Uint32Array;
  private readonly cache = new Map<string, { count: number; prons: string[] | undefined } | null>();

  /** Folder of the pronunciation model, read on the first estimate (none: no estimator). */
  modelDir: string | null = null;

  constructor(text: string, offsets: Uint32Array) {
    this.text = text;
    this.offsets = offsets;
  }

  estimate(word: string, k: number, prior?: readonly string[], hiatus?: readonly number[]): Candidate[] | undefined {
    return this.modelDir === null ? undefined : estimateWith(this.modelDir, word, k, prior, hiatus);
  }

  keepsHiatus(word: string, phones: string[], hiatus: readonly number[]): boolean | undefined {
    return this.modelDir === null ? undefined : keepsHiatusWith(this.modelDir, word, phones, hiatus);
  }

  /** Number of distinct words in the table. */
  get size(): number {
    return this.offsets.length;
  }

  pronunciations(word: string): string[] | undefined {
    return this.entry(word)?.prons;
  }

  count(word: string): number {
    return this.entry(word)?.count ?? 0;
  }

  private entry(word: string): { count: number; prons: string[] | undefined } | null {
    const hit = this.cache.get(word);
    if (hit !== undefined) return hit;
    const found = this.search(word);
    this.cache.set(word, found);
    return found;
  }

  private search(word: string): { count: number; prons: string[] | undefined } | null {
    const { text, offsets } = this;
    let lo = 0;
    let hi = offsets.length - 1;
    while (lo <= hi) {
      const mid = (lo + hi) >>> 1;
      const start = offsets[mid];
      const tab = text.indexOf('\t', start);
      const key = text.slice(start, tab);
      if (key === word) {
        const tab2 = text.indexOf('\t', tab + 1);
        const end = text.indexOf('\n', tab2 + 1);
        const count = Number(text.slice(tab + 1, tab2));
        const pronText = text.slice(tab2 + 1, end);
        return { count, prons: pronText ? pronText.split('|') : undefined };
      }
      if (key < word) lo = mid + 1;
      else hi = mid - 1;
    }
    return null;
  }
}

/** Finds the folder holding words.tsv: RUNGS_DATA_DIR, beside the bundle, or the repo's dist/. */
export function findDataDir(from?: string): string {
  const env = process.env.RUNGS_DATA_DIR;
  if (env && existsSync(join(env, 'words.tsv'))) return env;
  const starts = [from, typeof __dirname === 'string' ? __dirname : undefined, process.cwd()];
  for (const start of starts) {
    if (!start) continue;
    let dir = resolve(start);
    for (let i = 0; i < 8; i++) {
      for (const candidate of [join(dir, 'data'), join(dir, 'dist', 'data')]) {
        if (existsSync(join(candidate, 'words.tsv'))) return candidate;
      }
      const parent = dirname(dir);
      if (parent === dir) break;
      dir = parent;
    }
  }
  throw new Error('word tables not found: run `npm run build` (it writes dist/data/words.tsv)');
}

let shared: WordTable | undefined;

/** Loads the word table once per process. */
export function loadWordTable(dataDir?: string): WordTable {
  if (shared && !dataDir) return shared;
  const dir = dataDir ?? findDataDir();
  const text = readFileSync(join(dir, 'words.tsv'), 'latin1');
  const raw = readFileSync(join(dir, 'words.idx'));
  // A typed view needs 4-byte alignment; copy in the rare case the buffer is not aligned.
  const offsets =
    raw.byteOffset % 4 === 0
      ? new Uint32Array(raw.buffer, raw.byteOffset, raw.byteLength / 4)
      : new Uint32Array(raw.buffer.slice(raw.byteOffset, raw.byteOffset + raw.byteLength));
  const table = new WordTable(text, offsets);
  table.modelDir = dir;
  if (!dataDir) shared = table;
  return table;
}
