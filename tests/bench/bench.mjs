// `npm run bench`: Rungs' speed and memory beside a floor measured in the same run
// (tests/bench/floor.mjs: load the two dictionary packages naively, look every word up).
// In-process analysis and lint, whole `rungs` processes (start-up, a 200-file lint) and the
// language server over JSON-RPC at 200, 1,000 and 10,000 items. Prints a table of medians,
// percentiles and ratios, and with `--json FILE` writes the figures. It asserts nothing: targets
// are for people to read, and a shared machine is noisy, so read the ratios, not the milliseconds.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { availableParallelism, cpus, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { benchBalance } from './balance.mjs';
import { generateScript } from './generate.mjs';
import { measureLsp } from './lsp.mjs';
import { median, processRuns, timeAnalysis, timeLibraryLint, writeLibrary } from './runs.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const require = createRequire(import.meta.url);
const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const ITEMS = Number(process.env.BENCH_ITEMS ?? 10000);
const EDITS = Number(process.env.BENCH_EDITS ?? 40);
const jsonAt = process.argv.indexOf('--json');
const jsonFile = jsonAt >= 0 ? process.argv[jsonAt + 1] : null;

const dir = mkdtempSync(join(tmpdir(), 'rungs-bench-'));
const big = join(dir, 'library.rungs');
const tiny = join(dir, 'tiny.rungs');
const text = generateScript(ITEMS);
writeFileSync(big, text);
writeFileSync(tiny, 'Good morning.\n');
const { libDir, libFiles } = writeLibrary(dir);
const { wall, floorRun } = processRuns(root);

// 1. Start-up: a whole `rungs score` process on a one-line script vs a process that only loads
//    the packages. Both include Node's own start, so the ratio compares like with like.
const nodeOnly = [];
const floorLoad = [];
const floorLoadInner = [];
const floorRss = [];
const startup = [];
for (let i = 0; i < RUNS; i++) {
  nodeOnly.push(wall(['-e', '0']).ms);
  const f = floorRun([]);
  floorLoad.push(f.ms);
  floorLoadInner.push(f.loadMs);
  floorRss.push(f.rssMb);
  startup.push(wall([join(root, 'server/bin/rungs.js'), 'score', '--format', 'json', tiny]).ms);
}

// 2. Analysis and lint of the generated script in-process, after the tables are loaded, vs the
//    floor's lookups of every word of the same script (in its own process, after its load).
const { analyze, lint, loadWordTable } = require(join(root, 'dist', 'bench-core.js'));
const { analysis, linting, floorLookups, items, words } = timeAnalysis({ analyze, lint, loadWordTable }, join(root, 'dist', 'data'), text, big, RUNS, floorRun);

// 3. `rungs lint` over 200 files of 100 items (whole process) vs the floor's load plus twice its
//    lookup loop over the same words.
const { lint: multiLint, floorLoop: multiFloorLoop } = timeLibraryLint(root, { wall, floorRun }, libDir, libFiles, Math.max(3, Math.ceil(RUNS / 2)));

// 4. The language server over JSON-RPC, at three sizes.
const lsp = {};
for (const n of [200, 1000, 10000]) lsp[n] = await measureLsp(root, dir, generateScript(n), { edits: EDITS });

const floorLoopMs = median(floorLookups);
const floorLoadMs = median(floorLoad);
const multiFloor = floorLoadMs + 2 * median(multiFloorLoop);
const figures = {
  cores: availableParallelism(),
  cpu: cpus()[0]?.model ?? 'unknown',
  node: process.version,
  items,
  words,
  runs: RUNS,
  startupMs: median(startup),
  floorLoadMs,
  startupRatio: median(startup) / floorLoadMs,
  analysisMs: median(analysis),
  floorLoopMs,
  analysisRatio: median(analysis) / floorLoopMs,
  lintMs: median(linting),
  lintRatio: median(linting) / floorLoopMs,
  multiFileLintMs: median(multiLint),
  multiFileFloorMs: multiFloor,
  multiFileLintRatio: median(multiLint) / multiFloor,
  lsp,
  edit200P95Ms: lsp[200].edit.p95,
  edit10kP95Ms: lsp[10000].edit.p95,
  editScaleRatio: lsp[10000].edit.p95 / lsp[200].edit.p95,
  hover10kP95Ms: lsp[10000].hover.p95,
  inlay10kP95Ms: lsp[10000].inlay.p95,
  codeLens10kP95Ms: lsp[10000].codeLens.p95,
  completion10kP95Ms: lsp[10000].completion.p95,
  codeLensAfterEdit10kP95Ms: lsp[10000].afterEdit.codeLens.p95,
  inlayAfterEdit10kP95Ms: lsp[10000].afterEdit.inlay.p95,
  emptyAfterEdit10kP95Ms: lsp[10000].afterEdit.empty.p95,
  serverRssMb: lsp[10000].rssMb,
  floorRssMb: median(floorRss),
  rssRatio: lsp[10000].rssMb / median(floorRss),
};

const f1 = (n) => n.toFixed(1);
const row = (name, ms, base, ratio, target) =>
  `${name.padEnd(40)} ${f1(ms).padStart(8)} ms  floor ${f1(base).padStart(8)} ms  ratio ${ratio.toFixed(2).padStart(6)}x  target <= ${target}`;
const out = [
  `Rungs benchmark: ${ITEMS} generated items (${items} analysed, ${words} words), medians of ${RUNS} runs,`,
  `Node ${process.version}, ${figures.cores} cores (${figures.cpu})`,
  '',
  row('start-up, whole `rungs score` process', figures.startupMs, floorLoadMs, figures.startupRatio, '1.0x'),
  `${'  (floor load inside its process)'.padEnd(40)} ${f1(median(floorLoadInner)).padStart(8)} ms; bare \`node -e 0\` ${f1(median(nodeOnly))} ms`,
  row('analysis of the whole script', figures.analysisMs, floorLoopMs, figures.analysisRatio, '2x'),
  row('every rule on it (lint)', figures.lintMs, floorLoopMs, figures.lintRatio, '1x'),
  row('`rungs lint` 200 files x 100 items', figures.multiFileLintMs, multiFloor, figures.multiFileLintRatio, '1x (floor load + 2x loop)'),
  '',
  'language server over JSON-RPC (ms; edit = didChange to publishDiagnostics of that version)',
  `${'items'.padStart(6)} ${'open'.padStart(8)} ${'edit p50/p95'.padStart(16)} ${'hover p50/p95'.padStart(15)} ${'inlay p95'.padStart(10)} ${'lens p95'.padStart(9)} ${'compl p95'.padStart(10)} ${'RSS MB'.padStart(7)}`,
  ...Object.values(lsp).map(
    (r) =>
      `${String(r.items).padStart(6)} ${f1(r.openMs).padStart(8)} ${`${f1(r.edit.p50)} / ${f1(r.edit.p95)}`.padStart(16)} ${`${f1(r.hover.p50)} / ${f1(r.hover.p95)}`.padStart(15)} ${f1(r.inlay.p95).padStart(10)} ${f1(r.codeLens.p95).padStart(9)} ${f1(r.completion.p95).padStart(10)} ${f1(r.rssMb).padStart(7)}`,
  ),
  '',
  `edit p95 at 10,000 items / at 200 items   ${figures.editScaleRatio.toFixed(2)}x  (target <= 1.5x, and <= 50 ms: ${f1(figures.edit10kP95Ms)} ms)`,
  `read requests p95 at 10,000 items         hover ${f1(figures.hover10kP95Ms)}, inlay ${f1(figures.inlay10kP95Ms)}, lens ${f1(figures.codeLens10kP95Ms)}, completion ${f1(figures.completion10kP95Ms)} ms  (target <= 5 ms)`,
  `right after an edit, 10,000 items (p95)  code lens ${f1(figures.codeLensAfterEdit10kP95Ms)}, inlay ${f1(figures.inlayAfterEdit10kP95Ms)} ms  (each asked once for the new version, as an editor does)`,
  `  (a request needing no work, same place)  ${f1(figures.emptyAfterEdit10kP95Ms)} ms p95, ${f1(lsp[10000].afterEdit.empty.p50)} ms p50: the round trip itself`,
  `server RSS at 10,000 items / floor RSS    ${f1(figures.serverRssMb)} / ${f1(figures.floorRssMb)} MB = ${figures.rssRatio.toFixed(2)}x  (target <= 1.3x)`,
];
console.log(out.join('\n'));
for (const line of benchBalance({ analyze, balanceSets: require(join(root, 'dist', 'bench-core.js')).balanceSets }, loadWordTable(join(root, 'dist', 'data')))) console.log(line);
if (jsonFile) writeFileSync(jsonFile, `${JSON.stringify(figures, null, 2)}\n`);

// Model speech fitted to the timing plan (its own script: it needs espeak-ng and takes a while).
spawnSync(process.execPath, [join(root, 'tests/bench/audio.mjs')], { cwd: root, stdio: 'inherit' });

// 4. The pronunciation estimator on the held-out words, beside the rules it replaces.
const { pronounceReport } = await import('./pronounce.mjs');
console.log('');
console.log(pronounceReport());
