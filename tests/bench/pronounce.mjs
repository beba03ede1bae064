// The pronunciation estimator beside the NRL letter-to-sound rules and the npm `syllable`
// package, on the held-out tenth of the CMU Pronouncing Dictionary (FNV-1a 32 of the spelling
// mod 10 == 0, never used in training or tuning) and on invented pseudowords. `npm run bench`
// prints it; `node tests/bench/pronounce.mjs` prints it alone (after `npm run build`), and
// `node tests/bench/pronounce.mjs --dev FILE` scores a model trained with `--dev` on the
// development tenth instead, for choosing parameters.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { brotliDecompressSync } from 'node:zlib';
import { dictionary } from 'cmu-pronouncing-dictionary';
import { syllable } from 'syllable';
import { entries, part } from '../../server/scripts/g2p/data.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(import.meta.url);

export function pronounceReport(modelFile = join(root, 'dist', 'data', 'pronounce-model.txt.br'), which = 'test') {
  const core = require(join(root, 'dist', 'bench-core.js'));
  const heldOut = new Map();
  for (const [word, prons] of entries(dictionary)) if (part(word) === which) heldOut.set(word, prons);
  // The binary image the build writes beside the model (what a process reads when it is there),
  // timed first, before the text model is, so neither pays for the other's memory.
  const imageFile = join(dirname(modelFile), core.IMAGE_FILE);
  let imageRead = 'no image beside the model (run `npm run build`)';
  if (existsSync(imageFile)) {
    const c = process.cpuUsage();
    const t = performance.now();
    core.readModelImage(readFileSync(imageFile));
    const u = process.cpuUsage(c);
    imageRead = `its binary image read in ${((u.user + u.system) / 1000).toFixed(0)} ms CPU (${(performance.now() - t).toFixed(0)} ms wall)`;
  }
  const cpu0 = process.cpuUsage();
  const [forward, reverse] = core.parseModels(brotliDecompressSync(readFileSync(modelFile), { chunkSize: core.DECOMPRESS_CHUNK }));
  const estimator = { forward, reverse };
  const loadCpu = process.cpuUsage(cpu0);
  const loadMs = (loadCpu.user + loadCpu.system) / 1000;
  const modelBytes = [forward, reverse].reduce((t, m) => t + core.modelBytes(m), 0);

  // CPU per word, each beside the NRL rules timed in the same run on the same words (the
  // machine is shared, so the ratio is the figure to compare between runs).
  const perWord = (f) => {
    const c = process.cpuUsage();
    for (const word of heldOut.keys()) f(word);
    const u = process.cpuUsage(c);
    return (u.user + u.system) / heldOut.size;
  };
  const top = new Map();
  const rulesUs = perWord((w) => core.letterToSound(w));
  const estimatorUs = perWord((w) => top.set(w, core.estimateCandidates(estimator, w, 5)[0]?.phones ?? []));
  const forwardUs = perWord((w) => core.decode(forward, w, 5, 16));

  // What Rungs shows for a word it does not list: each word is hidden from the lookup (its stems
  // and the other words stay), so morphology on listed stems runs first, then initialisms letter
  // by letter, then the estimator.
  const table = core.loadWordTable(join(root, 'dist', 'data'));
  let hidden = '';
  const unlisted = {
    pronunciations: (w) => (w === hidden ? undefined : table.pronunciations(w)),
    count: (w) => table.count(w),
    estimate: (w, k, prior) => core.estimateCandidates(estimator, w, k, prior),
  };
  const systems = [
    ['Rungs for an unlisted word (morphology on listed stems, initialisms letter by letter, then the estimator)', (w) => ((hidden = w), { phones: core.estimatePronunciation(w, unlisted).phones })],
    ['joint-sequence estimator (both directions)', (w) => ({ phones: top.get(w) ?? core.estimateCandidates(estimator, w, 1)[0]?.phones ?? [] })],
    ['  its left-to-right model alone', (w) => ({ phones: core.decode(forward, w, 1)[0]?.phones ?? [] })],
    ['NRL letter-to-sound rules', (w) => ({ phones: core.letterToSound(w) })],
    ['npm `syllable` (syllables only)', (w) => ({ syllables: syllable(w) })],
  ];
  const pseudo = new Map(core.PSEUDOWORDS.map(([w, n]) => [w, [Array.from({ length: n }, () => 'AH0')]]));
  const pct = (x) => (x === null ? '–' : `${(100 * x).toFixed(1)} %`);
  const lines = [
    which === 'test'
      ? `Held-out words: ${heldOut.size} (FNV-1a 32 of the spelling mod 10 == 0); pseudowords: ${pseudo.size}`
      : `Development words: ${heldOut.size} (FNV-1a 32 of the spelling mod 10 == 1); pseudowords: ${pseudo.size}`,
    '',
    '| method | phones exact (no stress) | phones exact (stress) | phone error rate | syllables exact | primary stress exact | WCM exact | pseudoword syllables exact |',
    '|---|---:|---:|---:|---:|---:|---:|---:|',
  ];
  for (const [name, system] of systems) {
    const s = core.scorePronunciations(heldOut, system);
    const p = core.scorePronunciations(pseudo, system);
    lines.push(`| ${name} | ${pct(s.phonesExact)} | ${pct(s.phonesExactStress)} | ${pct(s.per)} | ${pct(s.syllablesExact)} | ${pct(s.stressExact)} | ${pct(s.wcmExact)} | ${pct(p.syllablesExact)} |`);
  }
  lines.push('');
  lines.push(
    `Estimator: text model read in ${loadMs.toFixed(0)} ms CPU, ${imageRead} (once, on the first estimate), ${(modelBytes / 1e6).toFixed(1)} MB in memory; ` +
      `${estimatorUs.toFixed(0)} µs CPU per word with the top 5 (target <= 1000), ${(estimatorUs / rulesUs).toFixed(0)}x the NRL rules' ${rulesUs.toFixed(0)} µs in this run; ` +
      `the left-to-right model's search alone ${forwardUs.toFixed(0)} µs.`,
  );
  return lines.join('\n');
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const dev = process.argv.indexOf('--dev');
  console.log(dev >= 0 ? pronounceReport(process.argv[dev + 1], 'dev') : pronounceReport());
}
