// The language-server half of the benchmark alone, for working on the edit and read path:
// `node tests/bench/lspOnly.mjs [ITEMS...]` (default 200 1000 10000) prints the same figures as
// `npm run bench` does for the server (edit and read percentiles, RSS). BENCH_EDITS and
// BENCH_PROFILE apply as there. Build first (`npm run build`).
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateScript } from './generate.mjs';
import { measureLsp } from './lsp.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const dir = mkdtempSync(join(tmpdir(), 'rungs-bench-lsp-'));
const sizes = process.argv.slice(2).map(Number).filter((n) => n > 0);
const f1 = (n) => n.toFixed(1);
const results = {};
for (const n of sizes.length ? sizes : [200, 1000, 10000]) {
  const r = await measureLsp(root, dir, generateScript(n), { edits: Number(process.env.BENCH_EDITS ?? 40), reads: Number(process.env.BENCH_READS ?? 60) });
  results[n] = r;
  console.log(
    `${String(n).padStart(6)} items  open ${f1(r.openMs)}  edit p50/p95 ${f1(r.edit.p50)} / ${f1(r.edit.p95)} (server CPU ${f1(r.edit.cpuMs)} per edit)  hover ${f1(r.hover.p95)}  inlay ${f1(r.inlay.p95)}  lens ${f1(r.codeLens.p95)}  compl ${f1(r.completion.p95)} ms; after an edit: lens ${f1(r.afterEdit.codeLens.p95)}  inlay ${f1(r.afterEdit.inlay.p95)}  no-work request ${f1(r.afterEdit.empty.p95)} ms  RSS ${f1(r.rssMb)} MB`,
  );
}
if (results[200] && results[10000]) console.log(`edit p95 10,000 / 200: ${(results[10000].edit.p95 / results[200].edit.p95).toFixed(2)}x`);
