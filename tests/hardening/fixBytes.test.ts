// Item 5 of the hardening issue: `--fix` changes only the bytes of its fixes, writes atomically
// keeping the file's mode, never overwrites an edit made during the run, and an unwritable file is
// a reported problem while the other files are still fixed.
import { chmodSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { CliFs } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { nodeFs } from '../../server/src/cli/nodeIo';
import { decodeLossless, encodeLossless } from '../../server/src/core/losslessText';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'rungs-fix-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

async function fix(fs: CliFs, ...files: string[]) {
  let out = '';
  let err = '';
  const code = await main({ argv: ['lint', '--fix', ...files], cwd: dir, fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {} });
  return { code, out, err };
}

const bytes = (...parts: (string | number[])[]) => Buffer.concat(parts.map((p) => (typeof p === 'string' ? Buffer.from(p, 'utf8') : Buffer.from(p))));

describe('lossless text', () => {
  it('round-trips invalid UTF-8 and decodes valid UTF-8 as the standard decoder does', () => {
    // Ill-formed sequences from Unicode 15 section 3.9 (table 3-8): C0 AF, E0 80 AF, F4 90 80 80,
    // a lone continuation byte, a truncated sequence, and an encoded surrogate ED A0 80.
    const b = bytes('a', [0xc0, 0xaf], 'b', [0xe0, 0x80, 0xaf], [0xf4, 0x90, 0x80, 0x80], [0x80], [0xe2, 0x82], 'c', [0xed, 0xa0, 0x80], 'é😀\ufeff');
    expect(Buffer.from(encodeLossless(decodeLossless(b)))).toEqual(b);
    const valid = Buffer.from('Ünïcödé 😀 text\r\n', 'utf8');
    expect(decodeLossless(valid)).toBe(valid.toString('utf8'));
  });
});

describe('rungs lint --fix on a real file', () => {
  it('keeps invalid UTF-8 and every byte outside the fix', async () => {
    const before = bytes('@pacse 1 wps\r\n== One\rSee you ', [0xff, 0xfe], ' soon.\nHi there.\r\n', [0xc3], 'Thank you.\n');
    writeFileSync(join(dir, 'a.rungs'), before);
    chmodSync(join(dir, 'a.rungs'), 0o640);
    const r = await fix(nodeFs, 'a.rungs');
    // The first byte that is not UTF-8 is told where it stands (line 3 after a CR-only break).
    expect(r.err).toBe('rungs lint: a.rungs:3:9: byte 0xFF is not UTF-8 (read as U+FFFD, so a word there may be misread); save the file as UTF-8\n');
    const after = readFileSync(join(dir, 'a.rungs'));
    // The only fix: "@pacse" becomes "@paces" (unknown-key, nearest key).
    expect(after).toEqual(Buffer.concat([Buffer.from('@paces'), before.subarray(6)]));
    expect(statSync(join(dir, 'a.rungs')).mode & 0o777).toBe(0o640);
  });

  it('sorts a rung in a CR-only and mixed-ending file keeping each line break in place', async () => {
    // Items of rising length; difficulty rises with length (length weight 0.5, see README).
    const hard = 'My granddaughter visits every Sunday afternoon.';
    const mid = 'Please pass the bread.';
    const easy = 'Hi.';
    const text = `== One\r${hard}\r${easy}\n${mid}\r\n`;
    writeFileSync(join(dir, 'a.rungs'), text);
    await fix(nodeFs, 'a.rungs');
    expect(readFileSync(join(dir, 'a.rungs'), 'utf8')).toBe(`== One\r${easy}\r${mid}\n${hard}\r\n`);
  });

  it('reports an unwritable file and goes on with the others', async () => {
    writeFileSync(join(dir, 'a.rungs'), '@pacse 1 wps\nHi.\n');
    writeFileSync(join(dir, 'b.rungs'), '@pacse 1 wps\nHi.\n');
    const fs: CliFs = {
      ...nodeFs,
      writeBytes: (p, b) => {
        if (p.endsWith('a.rungs')) throw Object.assign(new Error('EACCES'), { code: 'EACCES' });
        nodeFs.writeBytes!(p, b);
      },
    };
    const r = await fix(fs, 'a.rungs', 'b.rungs');
    expect(r.code).toBe(2);
    expect(r.err).toBe('rungs lint: a.rungs:1:1: cannot write the fixes (EACCES)\n');
    // a.rungs is reported as it is on disk, with its fixable problem; b.rungs was fixed.
    expect(r.out).toContain('a.rungs:1:1 error unknown-key');
    expect(readFileSync(join(dir, 'a.rungs'), 'utf8')).toBe('@pacse 1 wps\nHi.\n');
    expect(readFileSync(join(dir, 'b.rungs'), 'utf8')).toBe('@paces 1 wps\nHi.\n');
  });

  it('leaves a file alone when it changed during the run', async () => {
    writeFileSync(join(dir, 'a.rungs'), '@pacse 1 wps\nHi.\n');
    let reads = 0;
    const fs: CliFs = {
      ...nodeFs,
      readBytes: (p) => {
        const b = nodeFs.readBytes!(p);
        // Someone saves the file right after the first read.
        if (++reads === 1) writeFileSync(p, '@pacse 2 wps\nHello.\n');
        return b;
      },
    };
    const r = await fix(fs, 'a.rungs');
    expect(r.code).toBe(2);
    expect(r.err).toContain('the file changed while it was being checked; fixes not written');
    expect(readFileSync(join(dir, 'a.rungs'), 'utf8')).toBe('@pacse 2 wps\nHello.\n');
  });
});
