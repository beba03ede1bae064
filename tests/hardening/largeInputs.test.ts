// Item 1 of the hardening issue: inputs far larger than any real script must not overflow the call
// stack (spreads of 100,000+ arguments do), and JSON output is produced in bounded pieces.
import { describe, expect, it } from 'vitest';
import { concatAll, maxOf, minOf, pushAll } from '../../server/src/core/arrays';
import { parsePaces } from '../../server/src/core/pace';
import { parseScript } from '../../server/src/core/parse';
import { resolveScriptContext } from '../../server/src/config/resolve';
import { formatJson, formatJsonPieces, scoreJson } from '../../server/src/cli/formatScore';
import { batched, jsonPieces } from '../../server/src/cli/jsonStream';
import { lint, renderFindings } from '../../server/src/rules/index';
import { analyzeText } from '../helpers/data';
import { MemFs } from '../cli/memfs';

const N = 200_000;

describe('large inputs', () => {
  it('array helpers take more elements than a call can take arguments', () => {
    const big = Array.from({ length: N }, (_, i) => i % 1000);
    // Spreading this many arguments is what used to crash (V8 limit, computed: throws above ~1e5).
    expect(() => Math.max(...Array.from({ length: 2_000_000 }, () => 1))).toThrow(RangeError);
    expect(minOf(big)).toBe(0);
    expect(maxOf(big)).toBe(999);
    expect(minOf([], 0)).toBe(0);
    expect(pushAll([1], big).length).toBe(N + 1);
  });

  it('joins more lists than a call can take arguments, in order', () => {
    // 300,000 lists of 0-2 numbers: chunks of lists, then the chunks.
    const lists = Array.from({ length: 300_000 }, (_, i) => Array.from({ length: i % 3 }, (_, j) => i * 2 + j));
    const joined = concatAll(lists);
    const expected: number[] = [];
    for (const l of lists) for (const x of l) expected.push(x);
    expect(joined).toEqual(expected);
    expect(concatAll([])).toEqual([]);
    expect(concatAll([[1], [], [2, 3]])).toEqual([1, 2, 3]);
  });

  it('reads a @paces line of 200,000 numbers', () => {
    const { paces, error } = parsePaces(Array.from({ length: N }, () => '1.5').join(', ') + ' wps');
    expect(error).toBeNull();
    expect(paces.length).toBe(N);
  });

  it('reads 200,000 @set labels on a rung and an item', () => {
    const labels = Array.from({ length: N }, (_, i) => `s${i}`).join(' ');
    const s = parseScript(`== One\n@set ${labels}\nHi there. | @set ${labels}\n`);
    expect(s.rungs[0].sets.length).toBe(N);
    expect(s.rungs[0].items[0].sets.length).toBe(N);
  });

  it('analyses and lints a rung of 130,000 items', () => {
    const text = `== Big\n${'Hi there.\n'.repeat(130_000)}`;
    const a = analyzeText(text);
    expect(a.rungs[0].items.length).toBe(130_000);
    // Every item repeats the first; the duplicate rule is off to keep the test quick.
    expect(() => lint(a, text, { severities: { 'duplicate-item': 'off' } })).not.toThrow();
  });

  it('loads a valid lexicon of 200,000 entries', () => {
    const lex = Array.from({ length: N }, (_, i) => `w${i} = W IH1 N`).join('\n');
    const fs = new MemFs({ '.rungs.json': '{"lexicon": "words.txt"}', 'words.txt': lex, 'a.rungs': 'Hi.\n' });
    const ctx = resolveScriptContext('/clinic/a.rungs', fs);
    expect(ctx.findings).toEqual([]);
    expect(ctx.lexicon.length).toBe(N);
  });

  it('writes score JSON in bounded pieces that join to JSON.stringify', () => {
    const text = `== Big\n${'Hi there.\n'.repeat(3_000)}`;
    const a = analyzeText(text);
    const files = [{ file: 'big.rungs', analysis: a, problems: renderFindings(a.findings) }];
    const pieces = [...batched(formatJsonPieces(files), 1 << 16)];
    // Each write is a batch of small pieces: at most the batch size plus one item's JSON.
    expect(Math.max(...pieces.map((p) => p.length))).toBeLessThan((1 << 16) + 4096);
    expect(pieces.length).toBeGreaterThan(10);
    // Reference: the built-in serialiser on the same data (ECMA-262 JSON.stringify, indent 2).
    expect(pieces.join('')).toBe(`${JSON.stringify(scoreJson(files[0]), null, 2)}\n`);
    expect(formatJson([files[0], files[0]])).toBe(`${JSON.stringify([scoreJson(files[0]), scoreJson(files[0])], null, 2)}\n`);
  });

  it('jsonPieces matches JSON.stringify on edge values', () => {
    const v = { a: [], b: {}, c: [undefined, null, 1.5, 'x"\n'], d: undefined, e: { f: [{ g: true }] }, h: new Date(0) };
    expect([...jsonPieces(v)].join('')).toBe(JSON.stringify(v, null, 2));
    expect([...jsonPieces([])].join('')).toBe('[]');
  });
});
