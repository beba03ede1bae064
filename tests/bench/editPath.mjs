// The language server's edit path in one process, without the protocol: `node
// tests/bench/editPath.mjs [ITEMS] [EDITS]` (after `npm run build`) opens a generated script in
// the server's document store, then applies the benchmark's random one-line edits one by one,
// each followed by what a publish does (analysis, every rule, diagnostics, the message bytes),
// and prints the CPU time per edit. Steadier than the JSON-RPC figures on a shared machine, so it
// is the one to compare two builds with, in alternating runs.
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateScript, scriptEdits } from './generate.mjs';
import { percentile } from './lsp.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const { AnalysisStore, TextDocument, diagnosticsOf, loadWordTable, messageBytes } = createRequire(import.meta.url)(join(root, 'dist', 'bench-core.js'));

const n = Number(process.argv[2] ?? 10000);
const edits = Number(process.argv[3] ?? 300);
const store = new AnalysisStore(loadWordTable(join(root, 'dist', 'data')), { log() {}, error() {}, analyzed() {} });
const text = generateScript(n);
const uri = 'file:///bench/edit-path.rungs';
let doc = TextDocument.create(uri, 'rungs', 1, text);
const publish = () => {
  const s = store.get(doc);
  const diagnostics = diagnosticsOf(s.problems, uri);
  return messageBytes({ jsonrpc: '2.0', method: 'textDocument/publishDiagnostics', params: { uri, version: s.version, diagnostics } }).length;
};
publish();
// The same edits as tests/bench/lsp.mjs.
const { edit } = scriptEdits(text);
const cpu = [];
for (let i = 0; i < edits; i++) {
  const change = edit(i);
  const c0 = process.cpuUsage();
  doc = TextDocument.update(doc, [change], doc.version + 1);
  publish();
  const c = process.cpuUsage(c0);
  cpu.push((c.user + c.system) / 1000);
}
const mean = (xs) => xs.reduce((a, b) => a + b, 0) / xs.length;
const f1 = (x) => x.toFixed(1);
console.log(
  `${n} items, ${edits} edits: CPU per edit p50 ${f1(percentile(cpu, 50))}, p95 ${f1(percentile(cpu, 95))} ms; ` +
    `mean of the first 10 ${f1(mean(cpu.slice(0, 10)))}, of the first 40 ${f1(mean(cpu.slice(0, 40)))} ms`,
);
