// A focused measure of analysis, lint and multi-file `rungs lint` beside the floor, in one run:
// quicker than the whole `npm run bench` while working on throughput (`npm run bench:throughput`).
// Prints ratios measured in the same run; asserts nothing.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateScript } from './generate.mjs';
import { median, processRuns, timeAnalysis, timeLibraryLint, writeLibrary } from './runs.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(import.meta.url);
const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const ITEMS = Number(process.env.BENCH_ITEMS ?? 10000);
const only = process.env.BENCH_ONLY ?? 'analysis,multi';

const dir = mkdtempSync(join(tmpdir(), 'rungs-throughput-'));
const big = join(dir, 'library.rungs');
const text = generateScript(ITEMS);
writeFileSync(big, text);
const { libDir, libFiles } = writeLibrary(dir);
const { wall, floorRun } = processRuns(root);
const f1 = (n) => n.toFixed(1);

if (only.includes('analysis')) {
  const { analyze, lint, loadWordTable } = require(join(root, 'dist', 'bench-core.js'));
  const { analysis, linting, floorLookups: floor } = timeAnalysis({ analyze, lint, loadWordTable }, join(root, 'dist', 'data'), text, big, RUNS, floorRun);
  const fl = median(floor);
  if (process.env.BENCH_VERBOSE) console.log(`${analysis.map(f1).join(' ')} | ${linting.map(f1).join(' ')}`);
  console.log(`analysis ${f1(median(analysis))} ms = ${(median(analysis) / fl).toFixed(2)}x, lint ${f1(median(linting))} ms = ${(median(linting) / fl).toFixed(2)}x, floor loop ${f1(fl)} ms`);
}
if (only.includes('multi')) {
  const rounds = Math.max(3, Math.ceil(RUNS / 2));
  const { lint: lintMs, floorLoop: loop } = timeLibraryLint(root, { wall, floorRun }, libDir, libFiles, rounds);
  const load = Array.from({ length: rounds }, () => floorRun([]).ms);
  const floor = median(load) + 2 * median(loop);
  console.log(`rungs lint 200 files ${f1(median(lintMs))} ms = ${(median(lintMs) / floor).toFixed(2)}x of floor load ${f1(median(load))} + 2x loop ${f1(median(loop))} ms`);
}
