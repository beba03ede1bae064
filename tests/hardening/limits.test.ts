// The size bound: a script over it is checked up to the bound (whole lines) and the cut is
// reported; `--fix` never writes a file it could not read whole.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { CliFs } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { nodeFs } from '../../server/src/cli/nodeIo';
import { ReadRefused, readTextPrefix } from '../../server/src/node/boundedRead';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'rungs-limit-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

// A file system on which big.rungs is "over the bound": reading it whole is refused for its size,
// as the real bounded read does past 32 MiB; its prefix is the first 20 bytes, as readTextPrefix
// gives them (checked below on a real file with a small bound).
function overBound(): CliFs {
  const whole = '@pacse 1\nHi there.\nSee you soon.\n';
  writeFileSync(join(dir, 'big.rungs'), whole);
  return {
    ...nodeFs,
    readFile: (p) => {
      if (p.endsWith('big.rungs')) throw new ReadRefused('larger than 32 MiB', true);
      return nodeFs.readFile(p);
    },
    readBytes: (p) => {
      if (p.endsWith('big.rungs')) throw new ReadRefused('larger than 32 MiB', true);
      return nodeFs.readBytes!(p);
    },
    readPrefix: (p) => readTextPrefix(p, 20),
  };
}

async function run(fs: CliFs, argv: string[]) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: dir, fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {} });
  return { code, out, err };
}

describe('a script over the size bound', () => {
  it('readTextPrefix cuts after the last whole line within the bound', () => {
    writeFileSync(join(dir, 'a.rungs'), 'one\r\ntwo\nthree\rfour');
    expect(readTextPrefix(join(dir, 'a.rungs'), 12)).toBe('one\r\ntwo\n');
    expect(readTextPrefix(join(dir, 'a.rungs'), 100)).toBe('one\r\ntwo\nthree\r');
  });

  it('lint checks the first lines and reports the cut (exit 2)', async () => {
    const r = await run(overBound(), ['lint', 'big.rungs']);
    expect(r.err).toBe('rungs lint: big.rungs:1:1: larger than 32 MiB: checked up to line 2 only\n');
    expect(r.code).toBe(2);
    expect(r.out).toContain('big.rungs:1:1 error unknown-key');
  });

  it('score does the same', async () => {
    const r = await run(overBound(), ['score', 'big.rungs', '--format', 'csv']);
    expect(r.err).toBe('rungs score: big.rungs:1:1: larger than 32 MiB: checked up to line 2 only\n');
    expect(r.out.split('\n').filter(Boolean).length).toBe(2);
  });

  it('--fix leaves it untouched', async () => {
    const r = await run(overBound(), ['lint', '--fix', 'big.rungs']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('cannot read the file (larger than 32 MiB)');
    expect(readFileSync(join(dir, 'big.rungs'), 'utf8')).toBe('@pacse 1\nHi there.\nSee you soon.\n');
  });
});
