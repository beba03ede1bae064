// Runs the TextMate grammar tests (vscode-tmgrammar-test) over tests/grammar/*.test.rungs (copies
// of the sample scripts with scope assertions, and format.test.rungs for every construct), and
// checks that every part of every current sample script is coloured as its kind of line.
import { execFileSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as oniguruma from 'vscode-oniguruma';
import * as vsctm from 'vscode-textmate';
import { SETTINGS } from '../../server/src/core/settings';

const root = join(__dirname, '..', '..');
const here = join(root, 'tests', 'grammar');
const cli = join(root, 'node_modules', 'vscode-tmgrammar-test', 'dist', 'unit.js');

const { INITIAL, Registry } = vsctm;

/** The grammar, loaded with the same engine VS Code uses (vscode-textmate + Oniguruma). */
async function loadGrammar(): Promise<vsctm.IGrammar> {
  const wasm = readFileSync(join(root, 'node_modules', 'vscode-oniguruma', 'release', 'onig.wasm'));
  await oniguruma.loadWASM(wasm.buffer.slice(wasm.byteOffset, wasm.byteOffset + wasm.byteLength));
  const registry = new Registry({
    onigLib: Promise.resolve({
      createOnigScanner: (patterns: string[]) => new oniguruma.OnigScanner(patterns),
      createOnigString: (text: string) => new oniguruma.OnigString(text),
    }),
    loadGrammar: async () =>
      vsctm.parseRawGrammar(readFileSync(join(root, 'grammar', 'rungs.tmLanguage.json'), 'utf8'), 'rungs.tmLanguage.json'),
  });
  const g = await registry.loadGrammar('source.rungs');
  if (!g) throw new Error('grammar source.rungs did not load');
  return g;
}

/** The scope prefix a line's tokens must carry, from how the line starts (grammar/README.md). */
function kindOf(line: string): string | null {
  const t = line.trimStart();
  if (!t) return null;
  if (t.startsWith('//')) return 'comment.line';
  if (t.startsWith('==')) return 'markup.heading.rung';
  if (t.startsWith('@')) return 'meta.setting';
  return 'meta.item';
}

describe('TextMate grammar', () => {
  it('passes every scope assertion in tests/grammar', () => {
    let output = '';
    let status = 0;
    try {
      output = execFileSync(
        process.execPath,
        [cli, '--compact', '-g', join(root, 'grammar', 'rungs.tmLanguage.json'), join(here, '*.test.rungs')],
        { cwd: root, encoding: 'utf8' },
      );
    } catch (e) {
      const err = e as { status: number; stdout: string; stderr: string };
      status = err.status;
      output = err.stdout + err.stderr;
    }
    expect(output, output).not.toMatch(/ERROR|failed/);
    expect(status, output).toBe(0);
  });

  // The sample scripts change as the project grows; whatever they hold, every character that is
  // not blank must get a scope of its own, of the kind its line is.
  const samples = readdirSync(join(root, 'sample-scripts')).filter((f) => f.endsWith('.rungs'));
  it.each(samples)('colours every part of sample-scripts/%s', async (file) => {
    const grammar = await loadGrammar();
    const lines = readFileSync(join(root, 'sample-scripts', file), 'utf8').split(/\r?\n/);
    let stack = INITIAL;
    const bare: string[] = [];
    lines.forEach((line, n) => {
      const r = grammar.tokenizeLine(line, stack);
      stack = r.ruleStack;
      const kind = kindOf(line);
      for (const t of r.tokens) {
        const text = line.slice(t.startIndex, t.endIndex);
        if (!text.trim()) continue;
        if (t.scopes.length < 2) bare.push(`${file}:${n + 1} "${text}" has no scope`);
        else if (kind && !t.scopes[1].startsWith(kind)) bare.push(`${file}:${n + 1} "${text}" is ${t.scopes[1]}, not ${kind}`);
      }
    });
    expect(bare).toEqual([]);
  });

  // The settings table (server/src/core/settings.ts) is the one list of keys: every key and alias
  // a script may hold is coloured as a known setting, never as an unknown one.
  it('colours every key and alias of the settings table as a known setting', async () => {
    const grammar = await loadGrammar();
    const wrong: string[] = [];
    for (const spec of SETTINGS) {
      for (const key of [spec.key, ...spec.aliases]) {
        const line = `@${key} ${spec.example}`;
        const t = grammar.tokenizeLine(line, INITIAL).tokens.find((x) => x.startIndex === 1);
        const scope = t?.scopes.at(-1) ?? '(none)';
        if (!scope.startsWith('keyword.other.setting')) wrong.push(`@${key}: ${scope}`);
      }
    }
    expect(wrong).toEqual([]);
  });
});
