// What the benchmark scripts share: the generated 200-script library, medians, and timed runs
// of whole processes (a `rungs` command or the floor) from the repository root.
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { generateScript } from './generate.mjs';

/** A library of 200 scripts of 100 items each in `dir`/library, for `rungs lint` over many files. */
export function writeLibrary(dir) {
  const libDir = join(dir, 'library');
  mkdirSync(libDir);
  const libFiles = [];
  for (let i = 0; i < 200; i++) {
    const f = join(libDir, `script-${String(i).padStart(3, '0')}.rungs`);
    writeFileSync(f, generateScript(100, 1000 + i));
    libFiles.push(f);
  }
  return { libDir, libFiles };
}

export const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[s.length >> 1] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};

/** Timed whole processes run from `root`: `wall(args)` and the floor over some files. */
export function processRuns(root) {
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
  return { wall, floorRun };
}

/**
 * Analysis and lint of `text` in-process, `runs` times, each with a fresh word table so word
 * caches start cold as in a new process, beside the floor's lookups of the same words (in its own
 * process, after its load: `floorRun([file])`).
 */
export function timeAnalysis(core, dataDir, text, file, runs, floorRun) {
  const analysis = [];
  const linting = [];
  const floorLookups = [];
  let items = 0;
  let words = 0;
  for (let i = 0; i < runs; i++) {
    const table = core.loadWordTable(dataDir);
    const t = performance.now();
    const a = core.analyze({ text, data: table });
    analysis.push(performance.now() - t);
    const tl = performance.now();
    core.lint(a, text);
    linting.push(performance.now() - tl);
    items = a.items.length;
    words = a.items.reduce((n, it) => n + it.wordCount, 0);
    floorLookups.push(floorRun([file]).lookupMs);
  }
  return { analysis, linting, floorLookups, items, words };
}

/**
 * `rungs lint` over the library (whole processes) and the floor's lookup loop over the same
 * files, `rounds` times each: the multi-file lint figure is its median against the floor's load
 * plus twice the loop's median.
 */
export function timeLibraryLint(root, { wall, floorRun }, libDir, libFiles, rounds) {
  const lint = [];
  const floorLoop = [];
  for (let i = 0; i < rounds; i++) {
    lint.push(wall([join(root, 'server/bin/rungs.js'), 'lint', '--format', 'json', libDir]).ms);
    floorLoop.push(floorRun(libFiles).lookupMs);
  }
  return { lint, floorLoop };
}
