// Node-side loading of the pronunciation estimator's models. The build copies the committed model
// (server/data/pronounce-model.txt.br) into dist/data and writes its binary image beside it
// (core/g2p/modelImage.ts). Either is read on the first estimate a process needs, never at
// start-up: most scripts have no unknown words. The image is read in tens of milliseconds; the
// text model costs a decompression and a parse (a few hundred), so it is the fallback, used when
// the image is missing, damaged or was made from another model file.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliDecompressSync } from 'node:zlib';
import type { Candidate } from '../core/g2p/decode';
import { estimateCandidates, keepsHiatus, type Estimator } from '../core/g2p/estimator';
import { parseModels, type G2pModel } from '../core/g2p/model';
import { readModelImage, writeModelImage } from '../core/g2p/modelImage';
import { writeFileAtomic } from '../node/atomicWrite';

export const MODEL_FILE = 'pronounce-model.txt.br';
export const IMAGE_FILE = 'pronounce-model.bin';
/**
 * Output chunk of the decompression, larger than the decompressed model (about 17 MB). With the
 * default 16 kB chunks the text is built from a thousand small blocks and then copied into one,
 * and the memory of the blocks stays with the process (about 35 MB more resident memory after
 * loading, measured); one large block is mapped lazily, so only the pages written count, and it
 * is handed back whole when the text is dropped after parsing.
 */
export const DECOMPRESS_CHUNK = 32 * 1024 * 1024;

/** What an image records as its source: the SHA-256 and size of the model file it was made from. */
export function sourceDigest(modelFileBytes: Uint8Array): string {
  return `sha256:${createHash('sha256').update(modelFileBytes).digest('hex')} bytes:${modelFileBytes.length}`;
}

/** The models of a text model file (brotli-compressed). */
export function readModelFile(bytes: Uint8Array): G2pModel[] {
  return atLeastOne(parseModels(brotliDecompressSync(bytes, { chunkSize: DECOMPRESS_CHUNK })));
}

function atLeastOne(models: G2pModel[]): G2pModel[] {
  if (!models.length) throw new Error('holds no model');
  return models;
}

/**
 * The image of the model file in `dataDir`, written beside it unless one made from the same file
 * is there already (the build calls this). Written atomically by default, so a process reading
 * the model meanwhile (a lint during a rebuild) sees the old image or the new one, never half.
 * Says what it did.
 */
export function writeImageBeside(dataDir: string, write: (path: string, bytes: Uint8Array) => void = writeFileAtomic): 'written' | 'current' | 'no model' {
  const file = join(dataDir, MODEL_FILE);
  if (!existsSync(file)) return 'no model';
  const bytes = readFileSync(file);
  const source = sourceDigest(bytes);
  const image = join(dataDir, IMAGE_FILE);
  if (existsSync(image)) {
    try {
      if (readModelImage(readFileSync(image)).source === source) return 'current';
    } catch {
      // A damaged or older image is written again.
    }
  }
  write(image, writeModelImage(readModelFile(bytes), source));
  return 'written';
}

/**
 * The models in `dataDir`: from the image when it reads, checks and (with the model file beside
 * it) was made from that file; from the model file otherwise. Throws when neither can be read.
 */
export function readModels(dataDir: string): G2pModel[] {
  const file = join(dataDir, MODEL_FILE);
  const image = join(dataDir, IMAGE_FILE);
  const text = existsSync(file) ? readFileSync(file) : undefined;
  let imageError: string | undefined;
  if (existsSync(image)) {
    try {
      const read = readModelImage(readFileSync(image));
      if (text === undefined || read.source === sourceDigest(text)) return atLeastOne(read.models);
      imageError = `${image} was made from another model file`;
    } catch (err) {
      imageError = `${image}: ${err instanceof Error ? err.message : String(err)}`;
    }
  }
  if (text === undefined) throw new Error(imageError ?? `${file} not found: run \`npm run build\``);
  try {
    return readModelFile(text);
  } catch (err) {
    throw new Error(`${file}: ${err instanceof Error ? err.message : String(err)}${imageError ? `; ${imageError}` : ''}`);
  }
}

const loaded = new Map<string, Estimator | Error>();

/** The estimator in `dataDir`, read once per process; an Error when missing or unreadable. */
export function loadEstimator(dataDir: string): Estimator | Error {
  let hit = loaded.get(dataDir);
  if (hit === undefined) {
    try {
      const [forward, reverse] = readModels(dataDir);
      hit = { forward, reverse: reverse ?? null };
    } catch (err) {
      hit = err instanceof Error ? err : new Error(String(err));
    }
    loaded.set(dataDir, hit);
  }
  return hit;
}

/** Up to `k` estimated pronunciations of a lower-case spelling; undefined without a model. */
export function estimateWith(dataDir: string, word: string, k: number, prior?: readonly string[], hiatus?: readonly number[]): Candidate[] | undefined {
  const estimator = loadEstimator(dataDir);
  return estimator instanceof Error ? undefined : estimateCandidates(estimator, word, k, prior, hiatus);
}

/** Whether a pronunciation says the vowels at each hiatus apart; undefined without a model. */
export function keepsHiatusWith(dataDir: string, word: string, phones: string[], hiatus: readonly number[]): boolean | undefined {
  const estimator = loadEstimator(dataDir);
  return estimator instanceof Error ? undefined : keepsHiatus(estimator, word, phones, hiatus);
}
