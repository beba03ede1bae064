// The server's incremental re-analysis (checkScript with a document's cache) must give exactly what `analyze()` gives (the CLI's
// path), after any edit, including a one-character edit of a 10,000-item script. Timings are
// printed for people; the benchmark (`npm run bench`) is where speed is judged.
import { describe, expect, it } from 'vitest';
import { analyze, type AnalyzeOutput } from '../../server/src/core/analyze';
import { checkScript, type CheckCache } from '../../server/src/check/checkScript';
import { words } from '../helpers/data';
import { benchScript, bigScript, SENTENCES } from './bigScript';

// The server's path: checkScript with the document's cache (no config files on this file system).
const noFiles = { readFile: (p: string): string => { throw new Error(`no file ${p}`); }, exists: () => false };
const check = (text: string, cache: CheckCache | undefined) => checkScript({ text, path: '/w/a.rungs', fs: noFiles, data: words, cache });

const strip = (a: AnalyzeOutput) => JSON.stringify({ ...a, pronouncer: undefined, itemCache: undefined });

function rng(seed: number) {
  return () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
}

describe('incremental re-analysis', () => {
  it('equals analyze() after each of 60 random edits', () => {
    const rand = rng(42);
    let lines = bigScript(120, 20).split('\n');
    let cache: CheckCache | undefined;
    const edits = [
      (i: number) => (lines[i] = `${lines[i]} again`),
      (i: number) => lines.splice(i, 0, SENTENCES[Math.floor(rand() * SENTENCES.length)]),
      (i: number) => lines.splice(i, 1),
      (i: number) => lines.splice(i, 0, '== Inserted @pace 2 wps'),
      (i: number) => lines.splice(i, 0, '@say clarinet = K L EH1 R IH0 N EH2 T'),
      (i: number) => lines.splice(i, 0, `@paces ${1 + Math.floor(rand() * 3)} wps`),
      (i: number) => (lines[i] = `  ${lines[i]}`),
      (i: number) => lines.splice(i, 0, '@weights 0.2, 0.5, 0.3'),
    ];
    for (let step = 0; step < 60; step++) {
      edits[Math.floor(rand() * edits.length)](Math.floor(rand() * lines.length));
      const text = lines.join('\n');
      const inc = check(text, cache);
      cache = inc.cache;
      expect(strip(inc.analysis)).toBe(strip(analyze({ text, data: words })));
    }
  });

  // Times are printed for people; speed targets belong to `npm run bench`.
  it('a one-character edit of a 10,000-item script re-analyses to the same result', async () => {
    const text = await benchScript(10_000);
    let t = performance.now();
    const cold = check(text, undefined);
    const coldMs = performance.now() - t;
    const at = text.indexOf('the bread');
    const times: number[] = [];
    let state = cold;
    for (let i = 0; i < 5; i++) {
      const edited = `${text.slice(0, at)}the${'!'.repeat(i + 1)}${text.slice(at + 3)}`;
      t = performance.now();
      state = check(edited, state.cache);
      times.push(performance.now() - t);
    }
    t = performance.now();
    analyze({ text, data: words, reuse: state.cache.pronouncer });
    const fullMs = performance.now() - t;
    const median = [...times].sort((a, b) => a - b)[2];
    console.log(
      `10,000 items: cold analysis + lint ${coldMs.toFixed(0)} ms; after a one-character edit ${median.toFixed(0)} ms ` +
        `(median of 5; analyze() with a warm pronouncer alone: ${fullMs.toFixed(0)} ms)`,
    );
    expect(state.analysis.items.length).toBe(10_000);
    expect(strip(state.analysis)).toBe(strip(analyze({ text: `${text.slice(0, at)}the${'!'.repeat(5)}${text.slice(at + 3)}`, data: words })));
  });
});
