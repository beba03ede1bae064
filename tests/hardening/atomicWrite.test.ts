// Atomic writes (server/src/node/atomicWrite.ts): a file is replaced whole, keeping its permission
// bits, and a file that does not exist yet is created the same way with the mode new files get
// under the process's umask.
import { chmodSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../server/src/node/atomicWrite';

const dir = mkdtempSync(join(tmpdir(), 'rungs-atomic-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('writeFileAtomic', () => {
  it('replaces an existing file and keeps its permission bits', () => {
    const f = join(dir, 'old.rungs');
    writeFileSync(f, 'before');
    chmodSync(f, 0o640);
    writeFileAtomic(f, new TextEncoder().encode('after'));
    expect(readFileSync(f, 'utf8')).toBe('after');
    expect(statSync(f).mode & 0o777).toBe(0o640);
  });

  it('creates a file that does not exist yet, with the mode new files get, leaving no temporary file', () => {
    const f = join(dir, 'new.bin');
    writeFileAtomic(f, new Uint8Array([1, 2, 3]));
    expect([...readFileSync(f)]).toEqual([1, 2, 3]);
    // The same mode as a file node creates there itself (0666 less the umask).
    const ref = join(dir, 'reference');
    writeFileSync(ref, '');
    expect(statSync(f).mode & 0o777).toBe(statSync(ref).mode & 0o777);
    expect(readdirSync(dir).filter((n) => n.endsWith('.tmp'))).toEqual([]);
  });
});
