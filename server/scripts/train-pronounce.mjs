// Trains the pronunciation estimator: two joint-sequence (graphone) n-gram models (Bisani & Ney
// 2008, Speech Communication 50(5), 434-451), one over the spelling left to right and one right
// to left, on the CMU Pronouncing Dictionary from npm, and writes both into
// server/data/pronounce-model.txt.br. `npm run train:pronounce` runs it: the two models train in
// parallel child processes (about 10 minutes on two cores). The held-out tenth (g2p/data.mjs) is
// never read here.
//
//   node server/scripts/train-pronounce.mjs               train on train + dev, write the model
//   node server/scripts/train-pronounce.mjs --dev FILE    train on train only (to choose
//                                                         parameters on dev), write FILE
//     [--params JSON]                                     with these parameters changed
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { brotliCompressSync, constants } from 'node:zlib';
import { dictionary } from 'cmu-pronouncing-dictionary';
import { align } from './g2p/align.mjs';
import { entries, part } from './g2p/data.mjs';
import { MODEL_PATH, inputsChecksum, modelText } from './g2p/model-file.mjs';
import { kneserNey } from './g2p/ngram.mjs';
import { PARAMS } from './g2p/params.mjs';

const log = (msg) => process.stderr.write(`${new Date().toISOString().slice(11, 19)} ${msg}\n`);
const flag = (name) => {
  const at = process.argv.indexOf(name);
  return at >= 0 ? process.argv[at + 1] : undefined;
};
const DIRECTIONS = ['forward', 'reverse'];
// Parameters other than the committed ones are only for trials on the development tenth.
const params = flag('--params') === undefined ? PARAMS : { ...PARAMS, ...JSON.parse(flag('--params')) };
if (params !== PARAMS && flag('--dev') === undefined && flag('--direction') === undefined) throw new Error('--params needs --dev');

/** (spelling, phones) pairs of the chosen parts; reversed for the right-to-left model. */
function trainingPairs(parts, direction) {
  const pairs = [];
  for (const [word, prons] of entries(dictionary)) {
    if (!parts.includes(part(word))) continue;
    for (const phones of prons) {
      pairs.push(direction === 'reverse' ? [[...word].reverse().join(''), [...phones].reverse()] : [word, phones]);
    }
  }
  return pairs;
}

/** Aligns, counts and smooths one direction; returns its model text. */
function trainOne(direction, parts) {
  const pairs = trainingPairs(parts, direction);
  log(`${direction}: ${pairs.length} training pronunciations`);
  const aligned = align(pairs, params.shapes, params.emIterations, (m) => log(`${direction}: ${m}`));
  // Only graphones some best alignment uses go into the model, numbered from 1 in the order of
  // their keys: the graphones of one letter then have consecutive numbers, so the decoder finds
  // a letter's n-grams after a context as one run of the context's sorted successors.
  const usedIds = new Set();
  for (const p of aligned.paths) if (p !== null) for (const g of p) usedIds.add(g);
  const keys = [...usedIds].map((g) => aligned.keys[g]).sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const renumber = new Map([...usedIds].map((g) => [g, keys.indexOf(aligned.keys[g]) + 1]));
  const sequences = aligned.paths.filter((p) => p !== null).map((p) => p.map((g) => renumber.get(g)));
  log(`${direction}: ${keys.length} graphones; counting ${params.order}-grams`);
  const model = kneserNey(sequences, params.order, params.cutoffs);
  log(`${direction}: ${model.length} n-grams kept`);
  const header = { method: 'joint-sequence n-gram, modified Kneser-Ney', direction, params, checksum: inputsChecksum(params), graphones: keys };
  return modelText(header, model);
}

function child(direction, out, parts) {
  return new Promise((done, fail) => {
    const args = [...process.execArgv, fileURLToPath(import.meta.url), '--direction', direction, '--out', out, '--parts', parts.join(',')];
    if (params !== PARAMS) args.push('--params', JSON.stringify(params));
    spawn(process.execPath, args, { stdio: 'inherit' }).on('exit', (code) => (code === 0 ? done() : fail(new Error(`${direction} model: exit ${code}`))));
  });
}

const direction = flag('--direction');
if (direction !== undefined) {
  writeFileSync(flag('--out'), trainOne(direction, flag('--parts').split(',')));
} else {
  const devFile = flag('--dev');
  const parts = devFile === undefined ? ['train', 'dev'] : ['train'];
  const tmp = mkdtempSync(join(tmpdir(), 'rungs-train-'));
  await Promise.all(DIRECTIONS.map((d) => child(d, join(tmp, `${d}.txt`), parts)));
  const text = DIRECTIONS.map((d) => readFileSync(join(tmp, `${d}.txt`), 'utf8')).join('');
  rmSync(tmp, { recursive: true, force: true });
  const out = devFile ?? MODEL_PATH;
  mkdirSync(dirname(out), { recursive: true });
  const bytes = brotliCompressSync(text, {
    params: { [constants.BROTLI_PARAM_QUALITY]: 11, [constants.BROTLI_PARAM_LGWIN]: 24, [constants.BROTLI_PARAM_SIZE_HINT]: text.length },
  });
  writeFileSync(out, bytes);
  log(`${out}: ${(bytes.length / 1e6).toFixed(2)} MB`);
}
