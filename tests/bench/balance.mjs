// The set balancer's time on a 500-item script in 25 rungs of 20, half trained and half untrained
// at random (generated; invented text), whole-script and rung-by-rung scope, default move count.
// Part of `npm run bench`; prints, asserts nothing.
import { mulberry32 } from './generate.mjs';

export function setScript(items, scope, seed = 7) {
  const rand = mulberry32(seed);
  const words = ['tea', 'milk', 'bread', 'please', 'pass', 'the', 'butter', 'kettle', 'spoon', 'orange', 'juice', 'morning', 'visit', 'sister', 'garden', 'umbrella', 'telephone', 'chocolate', 'wash', 'cup', 'tomorrow', 'library'];
  const lines = [`@set-scope ${scope}`, '@set-min-items 5'];
  for (let i = 0; i < items; i++) {
    if (i % 20 === 0) lines.push(`== Level ${i / 20 + 1}`);
    const n = 1 + Math.floor(rand() * 8);
    const text = Array.from({ length: n }, () => words[Math.floor(rand() * words.length)]).join(' ');
    lines.push(`${text} ${i}. | @set ${i % 2 ? 'untrained' : 'trained'}`);
  }
  return `${lines.join('\n')}\n`;
}

export function benchBalance(core, table, runs = 3) {
  const out = [];
  for (const scope of ['script', 'rung']) {
    const text = setScript(500, scope);
    const analysis = core.analyze({ text, data: table });
    const times = [];
    let r;
    for (let i = 0; i < runs; i++) {
      const t = performance.now();
      r = core.balanceSets(analysis, text, { seed: 1 });
      times.push(performance.now() - t);
    }
    times.sort((a, b) => a - b);
    const ms = times[times.length >> 1];
    out.push(
      `${`balance 500 items (${scope} scope)`.padEnd(34)} ${ms.toFixed(1).padStart(8)} ms   ${r.iterations} moves, ${r.changes.length} labels changed, worst margin ${r.worstBefore.toFixed(3)} -> ${r.worstAfter.toFixed(3)} SD`,
    );
  }
  return out;
}
