// The line and script bounds of the analysis (core/limits.ts): a line over 10,000 characters or a
// script over 32 MiB is analysed up to the bound and reported by over-limit at its line and
// column; nothing is hung on and `--fix` rewrites nothing in such a file.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fc, it as fcIt } from '@fast-check/vitest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { checkScript } from '../../server/src/check/checkScript';
import { main } from '../../server/src/cli/main';
import { nodeFs } from '../../server/src/cli/nodeIo';
import { MAX_FILE_BYTES } from '../../server/src/node/boundedRead';
import { splitLines } from '../../server/src/core/parse';
import { boundText, MAX_LINE_CHARS, MAX_SCRIPT_BYTES, withinBounds } from '../../server/src/core/limits';
import { words } from '../helpers/data';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'rungs-line-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

async function run(argv: string[]) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: dir, fs: nodeFs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {} });
  return { code, out, err };
}

describe('boundText', () => {
  // The quick check against the definition it stands for: no carriage return, at most a third of
  // the byte bound in UTF-16 units, and every line (split at \n) at most maxLine long.
  fcIt.prop(
    [fc.array(fc.oneof(fc.constantFrom('', 'a', 'ab', 'abcd', 'abcdefgh', 'xyz\u00e9'), fc.string({ maxLength: 12 })), { maxLength: 30 }), fc.integer({ min: 0, max: 9 }), fc.integer({ min: 0, max: 400 })],
    { numRuns: 2000 },
  )('the quick check agrees with its definition', (lines, maxLine, maxBytes) => {
    const text = lines.join('\n');
    const expected = !text.includes('\r') && maxBytes >= text.length * 3 && text.split('\n').every((l) => l.length <= maxLine);
    expect(withinBounds(text, maxLine, maxBytes)).toBe(expected);
  });

  it('returns the text itself when nothing is over a bound', () => {
    const t = 'a\r\nbb\rccc\n';
    expect(boundText(t, 3, 100)).toEqual({ text: t, findings: [] });
  });

  it('cuts each long line at the bound and keeps every line break as it was', () => {
    const r = boundText('abcdef\r\nxy\rlmnopq', 4, 100);
    expect(r.text).toBe('abcd\r\nxy\rlmno');
    expect(r.findings.map((f) => [f.kind, f.line, f.character, f.endCharacter])).toEqual([
      ['line-over-limit', 0, 4, 6],
      ['line-over-limit', 2, 4, 6],
    ]);
  });

  it('keeps a line cut to nothing between a CR and an LF break as a line of its own', () => {
    // Found by the property below (counterexample ["\r😀\né", 1, 4]): the pair cannot be split,
    // so the line keeps nothing, and its LF must not join the CR before it into one CRLF break.
    const r = boundText('\r😀\né', 1, 100);
    expect(splitLines(r.text)).toEqual(['', '', 'é']);
    expect(r.findings.map((f) => [f.kind, f.line])).toEqual([['line-over-limit', 1]]);
  });

  it('does not split a surrogate pair', () => {
    // "ab😀": the emoji is two UTF-16 code units at 2 and 3 (computed); a cut at 3 keeps "ab".
    expect(boundText('ab😀cd', 3, 100).text).toBe('ab');
  });

  it('stops a script before the first line that does not fit in the byte bound (UTF-8)', () => {
    // "é" is 2 bytes in UTF-8 (RFC 3629): "aé\n" is 4 bytes, "bb\n" 3: 7 fit in 8, "cc" does not.
    const r = boundText('aé\nbb\ncc\ndd', 100, 8);
    expect(r.text).toBe('aé\nbb\n');
    expect(r.findings).toHaveLength(1);
    expect(r.findings[0]).toMatchObject({ kind: 'script-over-limit', line: 2, character: 0, endCharacter: 2, checkedLines: 2 });
  });

  it('documents its bounds', () => {
    const readme = readFileSync(join(__dirname, '..', '..', 'README.md'), 'utf8');
    expect(MAX_LINE_CHARS).toBe(10_000);
    expect(MAX_SCRIPT_BYTES).toBe(32 * 1024 * 1024);
    // The editor's bound is the CLI's file bound.
    expect(MAX_SCRIPT_BYTES).toBe(MAX_FILE_BYTES);
    expect(readme).toContain('| a line of a script | 10,000 characters |');
  });
});

// An item line of 15,000 characters ("Hi there, " 1,500 times, computed) in an otherwise short
// script with a misspelt setting whose fix is offered when nothing is over a bound.
const LONG = 'Hi there, '.repeat(1500);
const SCRIPT = `@pacse 1\n== One\nHi there.\n${LONG}\nSee you soon.\n`;

describe('a line over the bound', () => {
  it('is reported at its line and column 10,001 and the rest is still checked', async () => {
    writeFileSync(join(dir, 'long.rungs'), SCRIPT);
    const r = await run(['lint', 'long.rungs']);
    expect(r.out).toContain('long.rungs:4:10001 error over-limit this line has 15000 characters; only the first 10000 are checked');
    expect(r.out).toContain('long.rungs:1:1 error unknown-key');
    expect(r.code).toBe(1);
  });

  it('is analysed up to the bound: the item holds 1,000 words (10,000 characters / 10, computed)', () => {
    const c = checkScript({ text: SCRIPT, path: join(dir, 'long.rungs'), fs: nodeFs, data: words });
    const item = c.analysis.script.rungs[0].items.find((i) => i.line === 3)!;
    expect(item.text.length).toBeLessThanOrEqual(MAX_LINE_CHARS);
    expect(c.text).toBe(SCRIPT);
    expect(c.problems.every((p) => p.fix === undefined)).toBe(true);
  });

  it('makes --fix leave the whole file untouched (the same file without it is fixed)', async () => {
    writeFileSync(join(dir, 'long.rungs'), SCRIPT);
    await run(['lint', '--fix', 'long.rungs']);
    expect(readFileSync(join(dir, 'long.rungs'), 'utf8')).toBe(SCRIPT);
    const short = SCRIPT.replace(LONG, 'Hi there, friend.');
    writeFileSync(join(dir, 'short.rungs'), short);
    await run(['lint', '--fix', 'short.rungs']);
    expect(readFileSync(join(dir, 'short.rungs'), 'utf8')).toContain('@paces 1');
  });
});

describe('boundText on any text', () => {
  const text = fc.array(fc.oneof(fc.string({ unit: 'grapheme' }), fc.constantFrom('\n', '\r', '\r\n', '😀', 'é')), { maxLength: 30 }).map((a) => a.join(''));
  fcIt.prop([text, fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 60 })])(
    'keeps a prefix of each kept line, within both bounds, with a finding for every cut',
    (t, maxLine, maxBytes) => {
      const r = boundText(t, maxLine, maxBytes);
      const before = splitLines(t);
      const after = splitLines(r.text);
      // A script cut drops whole lines; the lines kept are prefixes of the originals.
      expect(after.length).toBeLessThanOrEqual(before.length);
      after.forEach((l, i) => {
        expect(before[i].startsWith(l)).toBe(true);
        expect(l.length).toBeLessThanOrEqual(maxLine);
        if (l.length < before[i].length && i < after.length - 1) expect(r.findings.some((f) => f.kind === 'line-over-limit' && f.line === i)).toBe(true);
      });
      expect(Buffer.byteLength(r.text, 'utf8')).toBeLessThanOrEqual(Math.max(maxBytes, 0));
      if (r.text !== t) expect(r.findings.length).toBeGreaterThan(0);
      else expect(r.findings).toEqual([]);
    },
  );
});
