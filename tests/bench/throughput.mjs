// A focused measure of analysis, lint and multi-file `rungs lint` beside the floor, in one run:
// quicker than the whole `npm run bench` while working on throughput (`node tests/bench/throughput.mjs`).
// Prints ratios measured in the same run; asserts nothing.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateScript } from './generate.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(import.meta.url);
const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const ITEMS = Number(process.env.BENCH_ITEMS ?? 10000);
const only = process.env.BENCH_ONLY ?? 'analysis,multi';

const dir = mkdtempSync(join(tmpdir(), 'rungs-throughput-'));
const big = join(dir, 'library.rungs');
const text = generateScript(ITEMS);
writeFileSync(big, text);
const libDir = join(dir, 'library');
mkdirSync(libDir);
const libFiles = [];
for (let i = 0; i < 200; i++) {
  const f = join(libDir, `script-${String(i).padStart(3, '0')}.rungs`);
  writeFileSync(f, generateScript(100, 1000 + i));
  libFiles.push(f);
}

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const wall = (args) => {
  const t = performance.now();
  const r = spawnSync(process.execPath, args, { cwd: root, encoding: 'utf8', maxBuffer: 1 << 28 });
  const ms = performance.now() - t;
  if (r.status !== 0 && r.status !== 1) throw new Error(`${args.join(' ')} failed: ${r.stderr}`);
  return { ms, out: r.stdout };
};
const floorRun = (files) => {
  const r = wall([join(root, 'tests/bench/floor.mjs'), ...files]);
  return { ...JSON.parse(r.out), ms: r.ms };
};
const f1 = (n) => n.toFixed(1);

if (only.includes('analysis')) {
  const { analyze, lint, loadWordTable } = require(join(root, 'dist', 'bench-core.js'));
  const analysis = [];
  const linting = [];
  const floor = [];
  for (let i = 0; i < RUNS; i++) {
    const table = loadWordTable(join(root, 'dist', 'data'));
    const t = performance.now();
    const a = analyze({ text, data: table });
    analysis.push(performance.now() - t);
    const tl = performance.now();
    lint(a, text);
    linting.push(performance.now() - tl);
    floor.push(floorRun([big]).lookupMs);
  }
  const fl = median(floor);
  if (process.env.BENCH_VERBOSE) console.log(`${analysis.map(f1).join(' ')} | ${linting.map(f1).join(' ')}`);
  console.log(`analysis ${f1(median(analysis))} ms = ${(median(analysis) / fl).toFixed(2)}x, lint ${f1(median(linting))} ms = ${(median(linting) / fl).toFixed(2)}x, floor loop ${f1(fl)} ms`);
}
if (only.includes('multi')) {
  const lintMs = [];
  const loop = [];
  const load = [];
  for (let i = 0; i < Math.max(3, Math.ceil(RUNS / 2)); i++) {
    lintMs.push(wall([join(root, 'server/bin/rungs.js'), 'lint', '--format', 'json', libDir]).ms);
    const f = floorRun(libFiles);
    loop.push(f.lookupMs);
    load.push(floorRun([]).ms);
  }
  const floor = median(load) + 2 * median(loop);
  console.log(`rungs lint 200 files ${f1(median(lintMs))} ms = ${(median(lintMs) / floor).toFixed(2)}x of floor load ${f1(median(load))} + 2x loop ${f1(median(loop))} ms`);
}
