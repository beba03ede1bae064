// Files in UTF-16 (what Windows Notepad saves as "Unicode" and spreadsheets export as "Unicode
// text") and UTF-8 with a byte-order mark read as their UTF-8 twins do, and are written back in
// their own encoding; UTF-16 without its mark and bytes that are not UTF-8 are told where they
// stand. Byte-order marks from the Unicode Standard (section 3.10, "Unicode Encoding Schemes":
// FE FF big-endian, FF FE little-endian; EF BB BF in UTF-8); the reference decoder is the
// platform's TextDecoder (WHATWG Encoding Standard).
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { main } from '../../server/src/cli/main';
import { nodeFs } from '../../server/src/cli/nodeIo';
import { decodeText, encodeText, encodingOf, lineAndColumn } from '../../server/src/core/textEncoding';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'rungs-enc-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

async function run(cwd: string, ...argv: string[]) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd, fs: nodeFs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {} });
  return { code, out, err };
}

const BOM = {
  'utf-8': Buffer.from([0xef, 0xbb, 0xbf]),
  'utf-16le': Buffer.from([0xff, 0xfe]),
  'utf-16be': Buffer.from([0xfe, 0xff]),
};
const utf16le = (text: string) => Buffer.from(text, 'utf16le');
const utf16be = (text: string) => utf16le(text).swap16();
const encoded = {
  'utf-8': (t: string) => Buffer.concat([BOM['utf-8'], Buffer.from(t, 'utf8')]),
  'utf-16le': (t: string) => Buffer.concat([BOM['utf-16le'], utf16le(t)]),
  'utf-16be': (t: string) => Buffer.concat([BOM['utf-16be'], utf16be(t)]),
};

// An invented script: a misspelt header key (fixable), a rung out of order and a word with an accent.
const SCRIPT = '@pacse 1 wps\n== Greetings\nGood morning, Zoë.\nHi.\nSee you soon.\n';

/** The same file in two folders, one in UTF-8 without a mark and one as `bytes`, run alike. */
async function twins(name: string, text: string, bytes: Buffer, ...argv: string[]) {
  const plain = join(dir, 'plain');
  const other = join(dir, 'other');
  mkdirSync(plain);
  mkdirSync(other);
  writeFileSync(join(plain, name), text);
  writeFileSync(join(other, name), bytes);
  return { plain: await run(plain, ...argv, name), other: await run(other, ...argv, name), plainDir: plain, otherDir: other };
}

describe('encodings', () => {
  for (const enc of ['utf-8', 'utf-16le', 'utf-16be'] as const) {
    it(`reads a script with a ${enc} byte-order mark as its UTF-8 twin, columns counted without the mark`, async () => {
      const r = await twins('a.rungs', SCRIPT, encoded[enc](SCRIPT), 'lint', '--format', 'json');
      expect(r.other.err).toBe('');
      expect(r.other.out).toBe(r.plain.out);
      // The misspelt key starts the first line: column 1, not moved by the mark.
      const [{ problems }] = JSON.parse(r.other.out);
      expect(problems.find((p: { rule: string }) => p.rule === 'unknown-key')).toMatchObject({ line: 1, column: 1, endColumn: 7 });
    });

    it(`writes fixes back in ${enc} with its mark`, async () => {
      const r = await twins('a.rungs', SCRIPT, encoded[enc](SCRIPT), 'lint', '--fix');
      expect(r.other.err).toBe('');
      const fixed = readFileSync(join(r.plainDir, 'a.rungs'), 'utf8');
      expect(fixed).not.toBe(SCRIPT);
      expect(readFileSync(join(r.otherDir, 'a.rungs'))).toEqual(encoded[enc](fixed));
    });
  }

  it('balances sets in a UTF-16 file and writes the labels back in UTF-16', async () => {
    const text = readFileSync(join(__dirname, '../../sample-scripts/kitchen-sets.rungs'), 'utf8');
    const r = await twins('k.rungs', text, encoded['utf-16le'](text), 'sets', '--balance', '--fix');
    expect(r.other.err).toBe('');
    const balanced = readFileSync(join(r.plainDir, 'k.rungs'), 'utf8');
    expect(balanced).not.toBe(text);
    expect(readFileSync(join(r.otherDir, 'k.rungs'))).toEqual(encoded['utf-16le'](balanced));
  });

  it('reads rate records exported as UTF-16 "Unicode text"', async () => {
    const csv = readFileSync(join(__dirname, '../../sample-scripts/morning-routine.C-0417.rates.csv'), 'utf8');
    const r = await twins('c.rates.csv', csv, encoded['utf-16le'](csv), 'progress', '--format', 'json');
    expect(r.other.err).toBe('');
    expect(r.other.out).toBe(r.plain.out);
    expect(JSON.parse(r.other.out)).toBeTruthy();
  });

  it('refuses UTF-16 without its mark, naming where the first NUL is', async () => {
    writeFileSync(join(dir, 'a.rungs'), utf16le(SCRIPT));
    const r = await run(dir, 'lint', 'a.rungs');
    expect(r.code).toBe(2);
    expect(r.err).toBe(
      'rungs lint: a.rungs:1:1: cannot read the file (it holds a NUL byte (line 1, column 2): is it UTF-16 without a byte-order mark? ' +
        'Rungs reads UTF-8, or UTF-16 that starts with its byte-order mark; save the file as UTF-8)\n',
    );
  });

  it('tells where the first byte that is not UTF-8 stands, and goes on', async () => {
    writeFileSync(join(dir, 'a.rungs'), Buffer.concat([Buffer.from('== One\r\nHi.\r\nGood '), Buffer.from([0xc3, 0x28]), Buffer.from(' day.\n')]));
    const r = await run(dir, 'score', 'a.rungs');
    expect(r.err).toBe('rungs score: a.rungs:3:6: byte 0xC3 is not UTF-8 (read as U+FFFD, so a word there may be misread); save the file as UTF-8\n');
    expect(r.out).toContain('Good \uFFFD( day.');
  });
});

describe('text encoding', () => {
  it('finds the encoding by its mark only', () => {
    expect(encodingOf(BOM['utf-16le'])).toBe('utf-16le');
    expect(encodingOf(BOM['utf-16be'])).toBe('utf-16be');
    expect(encodingOf(BOM['utf-8'])).toBe('utf-8');
    expect(encodingOf(utf16le('Hi'))).toBe('utf-8');
  });

  it('decodes UTF-16 as the platform decoder does, and any even run of bytes back to itself', () => {
    const text = '\uFEFFZoë 😀 says hi.\r\n';
    for (const enc of ['utf-16le', 'utf-16be'] as const) {
      const b = enc === 'utf-16le' ? utf16le(text) : utf16be(text);
      expect(decodeText(b, enc, false)).toBe(new TextDecoder(enc, { ignoreBOM: true }).decode(b));
    }
    // Lone surrogates included: the bytes come back as they were.
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 64 }), fc.boolean(), (raw, le) => {
        const b = raw.subarray(0, raw.length - (raw.length % 2));
        const enc = le ? 'utf-16le' : 'utf-16be';
        expect(Buffer.from(encodeText(decodeText(b, enc, true), enc))).toEqual(Buffer.from(b));
      }),
    );
  });

  it('refuses UTF-16 with an odd number of bytes', () => {
    expect(() => decodeText(Buffer.from([0xff, 0xfe, 0x41]), 'utf-16le', false)).toThrow(/odd number of bytes/);
  });

  it('counts lines as scripts are split (\\r\\n, \\r, \\n)', () => {
    expect(lineAndColumn('a\r\nb\rc\nd', 7)).toEqual({ line: 4, column: 1 });
    expect(lineAndColumn('ab', 1)).toEqual({ line: 1, column: 2 });
  });
});
