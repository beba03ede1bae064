// The committed model file of the pronunciation estimator, and the checksum of what made it.
//
// Format (Brotli-compressed UTF-8 text, read by server/src/core/g2p/model.ts): two models one after the
// other, the left-to-right one first, each
//   a header line: JSON { format, method, direction, scale, params, checksum, graphones, entries },
//   graphone i+1 = graphones[i] (0 is the word boundary), in the order of their keys (format 2),
//   so the graphones of one letter have consecutive numbers
//   then one line per n-gram, by order, then context, then token:
//     <context step> <token> <log10 p x scale> [<log10 backoff x scale>]   (rounded)
//   `entries` is the number of those lines, so a reader allocates once and reads in one pass.
//   The context is the n-gram's line number among the entries (0-based; -1 for unigrams), written
//   as the difference from the previous line's context so that the file compresses well. The
//   backoff weight is present on n-grams that are the context of a longer one.
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
export const ROOT = join(here, '..', '..', '..');
export const MODEL_PATH = join(ROOT, 'server', 'data', 'pronounce-model.txt.br');
export const FORMAT = 2;
/** Log probabilities are stored in steps of 1/SCALE (0.002 log10: 0.5 % of a probability). */
export const SCALE = 500;

/** Files whose bytes decide the model: the dictionary and the training code. */
export const INPUT_FILES = [
  'node_modules/cmu-pronouncing-dictionary/index.js',
  'server/scripts/train-pronounce.mjs',
  'server/scripts/g2p/data.mjs',
  'server/scripts/g2p/align.mjs',
  'server/scripts/g2p/ngram.mjs',
  'server/scripts/g2p/model-file.mjs',
  'server/scripts/g2p/params.mjs',
];

/** SHA-256 over the input files (path and bytes) and the parameters, hex. */
export function inputsChecksum(params) {
  const h = createHash('sha256');
  for (const f of INPUT_FILES) {
    h.update(`${f}\n`);
    // Line endings are normalised so a checkout with CRLF gives the same checksum.
    h.update(readFileSync(join(ROOT, f), 'utf8').replace(/\r\n/g, '\n'));
  }
  h.update(JSON.stringify(params));
  return h.digest('hex');
}

/** Serialises entries from kneserNey() after a header line with the graphone inventory. */
export function modelText(header, entries) {
  const index = new Map();
  const lines = [JSON.stringify({ format: FORMAT, scale: SCALE, ...header, entries: entries.length })];
  let prevCtx = -1;
  entries.forEach((e, i) => {
    index.set(e.ids.join(' '), i);
    const ctx = e.order === 1 ? -1 : index.get(e.ids.slice(0, -1).join(' '));
    if (ctx === undefined) throw new Error(`context missing for ${e.ids.join(' ')}`);
    let line = `${ctx - prevCtx} ${e.ids.at(-1)} ${Math.round(e.logp * SCALE)}`;
    if (e.bow !== null) line += ` ${Math.round(e.bow * SCALE)}`;
    lines.push(line);
    prevCtx = ctx;
  });
  return `${lines.join('\n')}\n`;
}
