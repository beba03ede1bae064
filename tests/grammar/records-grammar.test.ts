// The records grammar colours each column of a rate records file with its own scope, whatever the
// delimiter, and keeps a quoted cell (with delimiters inside) whole. Checked with the engine VS
// Code uses (vscode-textmate + Oniguruma).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as oniguruma from 'vscode-oniguruma';
import * as vsctm from 'vscode-textmate';

const root = join(__dirname, '..', '..');

async function loadGrammar(): Promise<vsctm.IGrammar> {
  const wasm = readFileSync(join(root, 'node_modules', 'vscode-oniguruma', 'release', 'onig.wasm'));
  await oniguruma.loadWASM(wasm.buffer.slice(wasm.byteOffset, wasm.byteOffset + wasm.byteLength)).catch(() => undefined);
  const registry = new vsctm.Registry({
    onigLib: Promise.resolve({
      createOnigScanner: (patterns: string[]) => new oniguruma.OnigScanner(patterns),
      createOnigString: (text: string) => new oniguruma.OnigString(text),
    }),
    loadGrammar: async () => vsctm.parseRawGrammar(readFileSync(join(root, 'grammar', 'rungs-records.tmLanguage.json'), 'utf8'), 'rungs-records.tmLanguage.json'),
  });
  return (await registry.loadGrammar('source.rungs-records'))!;
}

/** Each non-delimiter token's text and the column number in its scope. */
function columns(g: vsctm.IGrammar, line: string): [string, number][] {
  const { tokens } = g.tokenizeLine(line, vsctm.INITIAL);
  return tokens
    .map((t): [string, string[]] => [line.slice(t.startIndex, t.endIndex), t.scopes])
    .filter(([, s]) => s.some((x) => /column-\d+/.test(x)))
    .map(([text, s]): [string, number] => [text, Number(/column-(\d+)/.exec(s.find((x) => /column-\d+/.test(x))!)![1])]);
}

describe('records grammar', () => {
  it.each([',', ';', '\t'])('gives each cell its column (delimiter %j)', async (d) => {
    const g = await loadGrammar();
    const line = ['2026-03-02', 'C-0417', 'a.rungs', 'Short', 'paced', '12', '10'].join(d);
    expect(columns(g, line)).toEqual([['2026-03-02', 1], ['C-0417', 2], ['a.rungs', 3], ['Short', 4], ['paced', 5], ['12', 6], ['10', 7]]);
  });

  it('keeps a quoted cell with delimiters and doubled quotes whole', async () => {
    const g = await loadGrammar();
    expect(columns(g, '2026-03-02,"said ""yes"", then, paused",x')).toEqual([['2026-03-02', 1], ['"said ""yes"", then, paused"', 2], ['x', 3]]);
  });
});
