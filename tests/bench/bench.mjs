// `npm run bench`: start-up and analysis time of Rungs beside a floor measured in the same run
// (tests/bench/floor.mjs: load the two dictionary packages naively, look every word up).
// Prints medians and ratios; it asserts nothing (targets are for people to read, machines are noisy).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateScript } from './generate.mjs';
import { benchBalance } from './balance.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(import.meta.url);
const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const ITEMS = Number(process.env.BENCH_ITEMS ?? 10000);

const dir = mkdtempSync(join(tmpdir(), 'rungs-bench-'));
const big = join(dir, 'library.rungs');
const tiny = join(dir, 'tiny.rungs');
writeFileSync(big, generateScript(ITEMS));
writeFileSync(tiny, 'Good morning.\n');

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const wall = (args) => {
  const t = performance.now();
  const r = spawnSync(process.execPath, args, { cwd: root, encoding: 'utf8' });
  const ms = performance.now() - t;
  if (r.status !== 0 && r.status !== 1) throw new Error(`${args.join(' ')} failed: ${r.stderr}`);
  return { ms, out: r.stdout };
};

// 1. Start-up: a whole `rungs score` process on a one-line script vs a process that only loads the
//    packages. Both include Node's own start, so the ratio compares like with like.
const nodeOnly = [];
const floorLoad = [];
const floorLoadInner = [];
const startup = [];
for (let i = 0; i < RUNS; i++) {
  nodeOnly.push(wall(['-e', '0']).ms);
  const f = wall([join(root, 'tests/bench/floor.mjs')]);
  floorLoad.push(f.ms);
  floorLoadInner.push(JSON.parse(f.out).loadMs);
  startup.push(wall([join(root, 'server/bin/rungs.js'), 'score', '--format', 'json', tiny]).ms);
}

// 2. Analysis of the generated script in-process, after the tables are loaded, vs the floor's
//    lookups of every word of the same script (in its own process, after its load).
const { analyze, lint, loadWordTable } = require(join(root, 'dist', 'bench-core.js'));
const text = generateScript(ITEMS);
const analysis = [];
const linting = [];
const floorLookups = [];
let items = 0;
let words = 0;
for (let i = 0; i < RUNS; i++) {
  // A fresh table each run, so word caches start cold as in a new process.
  const table = loadWordTable(join(root, 'dist', 'data'));
  const t = performance.now();
  const a = analyze({ text, data: table });
  analysis.push(performance.now() - t);
  const tl = performance.now();
  lint(a, text);
  linting.push(performance.now() - tl);
  items = a.items.length;
  words = a.items.reduce((n, it) => n + it.wordCount, 0);
  floorLookups.push(JSON.parse(wall([join(root, 'tests/bench/floor.mjs'), big]).out).lookupMs);
}


const row = (name, ms, base, target) =>
  `${name.padEnd(34)} ${ms.toFixed(1).padStart(8)} ms   floor ${base.toFixed(1).padStart(8)} ms   ratio ${(ms / base).toFixed(2).padStart(6)}x${target ? `   (target <= ${target})` : ''}`;
const nodeMs = median(nodeOnly);
console.log(`Rungs benchmark: ${ITEMS} generated items (${items} analysed, ${words} words), median of ${RUNS} runs, Node ${process.version}`);
console.log(row('start-up, whole process', median(startup), median(floorLoad), '1.0x'));
console.log(row('start-up minus bare node', median(startup) - nodeMs, median(floorLoad) - nodeMs, '1.0x'));
console.log(`${'  (floor load inside its process)'.padEnd(34)} ${median(floorLoadInner).toFixed(1).padStart(8)} ms;  bare \`node -e 0\` ${nodeMs.toFixed(1)} ms`);
console.log(row('analysis of the whole script', median(analysis), median(floorLookups), '2x'));
console.log(`${'  per item'.padEnd(34)} ${((1000 * median(analysis)) / items).toFixed(2).padStart(8)} µs`);
console.log(row('every rule on the analysis (lint)', median(linting), median(floorLookups)));
for (const line of benchBalance({ analyze, balanceSets: require(join(root, 'dist', 'bench-core.js')).balanceSets }, loadWordTable(join(root, 'dist', 'data')))) console.log(line);

// 3. Model speech fitted to the timing plan (its own script: it needs espeak-ng and takes a while).
spawnSync(process.execPath, [join(root, 'tests/bench/audio.mjs')], { cwd: root, stdio: 'inherit' });
