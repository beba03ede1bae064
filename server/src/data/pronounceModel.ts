// Node-side loading of the pronunciation estimator's models (dist/data/pronounce-model.txt.br,
// copied there by the build from server/data/). It is read on the first estimate a process
// needs, never at start-up: most scripts have no unknown words, and reading the model costs a
// few hundred milliseconds.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliDecompressSync } from 'node:zlib';
import type { Candidate } from '../core/g2p/decode';
import { estimateCandidates, type Estimator } from '../core/g2p/estimator';
import { parseModels } from '../core/g2p/model';

export const MODEL_FILE = 'pronounce-model.txt.br';
/**
 * Output chunk of the decompression, larger than the decompressed model (about 17 MB). With the
 * default 16 kB chunks the text is built from a thousand small blocks and then copied into one,
 * and the memory of the blocks stays with the process (about 35 MB more resident memory after
 * loading, measured); one large block is mapped lazily, so only the pages written count, and it
 * is handed back whole when the text is dropped after parsing.
 */
export const DECOMPRESS_CHUNK = 32 * 1024 * 1024;

const loaded = new Map<string, Estimator | Error>();

/** The estimator in `dataDir`, read once per process; an Error when missing or unreadable. */
export function loadEstimator(dataDir: string): Estimator | Error {
  let hit = loaded.get(dataDir);
  if (hit === undefined) {
    const file = join(dataDir, MODEL_FILE);
    try {
      if (existsSync(file)) {
        const [forward, reverse] = parseModels(brotliDecompressSync(readFileSync(file), { chunkSize: DECOMPRESS_CHUNK }));
        hit = { forward, reverse: reverse ?? null };
      } else hit = new Error(`${file} not found: run \`npm run build\``);
    } catch (err) {
      hit = new Error(`${file}: ${err instanceof Error ? err.message : String(err)}`);
    }
    loaded.set(dataDir, hit);
  }
  return hit;
}

/** Up to `k` estimated pronunciations of a lower-case spelling; undefined without a model. */
export function estimateWith(dataDir: string, word: string, k: number, prior?: readonly string[]): Candidate[] | undefined {
  const estimator = loadEstimator(dataDir);
  return estimator instanceof Error ? undefined : estimateCandidates(estimator, word, k, prior);
}
