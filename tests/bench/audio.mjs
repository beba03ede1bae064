// Part of `npm run bench`: model speech of every rung of the sample scripts at three paces, made
// with the real espeak-ng and measured with the onset detector against the timing plan. Prints the
// achieved words per second against the target (goal within 3 %) and the mean absolute word-onset
// error (goal 50 ms or less). Skips with a message when espeak-ng is missing.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(import.meta.url);
const { analyze, loadWordTable, makeModelAudio, ESPEAK, findOnPath, makePace } = require(join(root, 'dist', 'bench-core.js'));

const program = findOnPath(ESPEAK);
if (!program) {
  console.log('model speech: skipped, espeak-ng is not installed (apt-get install espeak-ng)');
  process.exit(0);
}
const SCRIPTS = ['morning-routine.rungs', 'kitchen-sets.rungs', 'family-visits-draft.rungs'];
const PACES = (process.env.BENCH_PACES ?? '1,2,3').split(',').map(Number);
const table = loadWordTable(join(root, 'dist', 'data'));
const out = mkdtempSync(join(tmpdir(), 'rungs-bench-audio-'));
console.log(`model speech (espeak-ng at ${program}), ${SCRIPTS.length} sample scripts, every rung:`);
console.log('  pace      words  found   achieved w/s   vs target   mean onset error   largest   time');
try {
  for (const p of PACES) {
    const t = performance.now();
    const all = { words: 0, matched: 0, errorSum: 0, maxError: 0, spoken: 0, measured: 0, planned: 0 };
    for (const name of SCRIPTS) {
      const analysis = analyze({ text: readFileSync(join(root, 'sample-scripts', name), 'utf8'), data: table });
      const rungs = analysis.rungs.filter((r) => r.items.length).map((r) => r.index);
      const r = makeModelAudio({ analysis, rungs, pace: makePace(p, 'wps'), mode: 'unison', outDir: out, program, voice: 'en-us', writeBytes: () => {} });
      const m = r.measurement;
      all.words += m.words;
      all.matched += m.matched;
      all.errorSum += m.meanOnsetError * m.matched;
      all.maxError = Math.max(all.maxError, m.maxOnsetError);
      all.spoken += m.spokenWords;
      all.measured += m.measuredSeconds;
      all.planned += m.plannedSeconds;
    }
    const achieved = all.spoken / all.measured;
    const target = all.spoken / all.planned;
    const diff = (achieved / target - 1) * 100;
    console.log(
      `  ${`${p} wps`.padEnd(8)} ${String(all.words).padStart(6)} ${String(all.matched).padStart(6)}   ${achieved.toFixed(3).padStart(12)}   ${`${diff >= 0 ? '+' : ''}${diff.toFixed(2)} %`.padStart(9)}   ${`${((all.errorSum / all.matched) * 1000).toFixed(1)} ms`.padStart(16)}   ${`${(all.maxError * 1000).toFixed(0)} ms`.padStart(7)}   ${((performance.now() - t) / 1000).toFixed(1)} s`,
    );
  }
} finally {
  rmSync(out, { recursive: true, force: true });
}
console.log('  goals: achieved words/s within 3 % of the target; mean onset error 50 ms or less');
