// Items 2 and 3 of the hardening issue on a real file system: folder-link cycles, pipes named
// *.rungs, lexicons outside their config's folder, non-regular and oversized files.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { expandPaths } from '../../server/src/cli/files';
import { main } from '../../server/src/cli/main';
import { nodeFs } from '../../server/src/cli/nodeIo';
import { resolveScriptContext, type ScriptContext } from '../../server/src/config/resolve';
import { renderFindings } from '../../server/src/rules/index';
import { excerpt } from '../../server/src/core/excerpt';
import { MAX_FILE_BYTES, readBytesBounded } from '../../server/src/node/boundedRead';

/** The resolver's findings as the rules word them (what `rungs lint` and the editor show). */
const rendered = (ctx: ScriptContext) => ctx.findings.map(({ file, finding }) => ({ file, problem: renderFindings([finding])[0] }));

const root = join(__dirname, '..', '..');
const SCRIPT = '== One\nSee you soon.\nHi there.\nThank you.\n';
let dir: string;

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'rungs-hard-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

async function lint(args: string[]) {
  let out = '';
  let err = '';
  const code = await main({ argv: ['lint', ...args], cwd: dir, fs: nodeFs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {} });
  return { code, out, err };
}

describe('folder walk', () => {
  it('visits each real folder once through link cycles and checks each file once', async () => {
    writeFileSync(join(dir, 'a.rungs'), '@pacse 1\nHi.\n');
    mkdirSync(join(dir, 'sub'));
    symlinkSync('..', join(dir, 'sub', 'up'));
    symlinkSync('.', join(dir, 'self1'));
    symlinkSync('.', join(dir, 'self2'));
    symlinkSync(join(dir, 'a.rungs'), join(dir, 'sub', 'b.rungs'));
    const { files } = expandPaths(['.'], dir, nodeFs);
    expect(files).toEqual([join(dir, 'a.rungs')]);
    const r = await lint(['.']);
    expect(r.out.match(/unknown-key/g)?.length).toBe(1);
  });

  it('skips a named pipe called *.rungs instead of blocking on it', async () => {
    writeFileSync(join(dir, 'a.rungs'), SCRIPT);
    execFileSync('mkfifo', [join(dir, 'pipe.rungs')]);
    expect(expandPaths(['.'], dir, nodeFs).files).toEqual([join(dir, 'a.rungs')]);
    // Named on the command line, the pipe is reported as not a regular file; the run goes on.
    const r = await lint(['pipe.rungs', 'a.rungs']);
    expect(r.code).toBe(2);
    expect(r.err).toContain('pipe.rungs:1:1: cannot read the file (not a regular file)');
    expect(r.out).toBe('1 file checked: no problems\n');
  });
});

describe('what a config may read', () => {
  it('refuses lexicons outside the config folder, absolute or by "..", or through a link', () => {
    mkdirSync(join(dir, 'proj'));
    writeFileSync(join(dir, 'secret.txt'), 'TOKEN = S3CR3T\n');
    symlinkSync(join(dir, 'secret.txt'), join(dir, 'proj', 'link.txt'));
    for (const name of ['/proc/self/environ', '../secret.txt', 'link.txt']) {
      writeFileSync(join(dir, 'proj', '.rungs.json'), JSON.stringify({ lexicon: name }));
      const ctx = resolveScriptContext(join(dir, 'proj', 'a.rungs'), nodeFs);
      expect(ctx.lexicon).toEqual([]);
      expect(rendered(ctx).map((p) => p.problem.message).join('\n')).toMatch(/is outside the folder of the config file/);
      expect(JSON.stringify(rendered(ctx))).not.toContain('S3CR3T');
    }
  });

  it('a lexicon inside the folder still loads', () => {
    writeFileSync(join(dir, '.rungs.json'), JSON.stringify({ lexicon: 'names.lexicon' }));
    writeFileSync(join(dir, 'names.lexicon'), 'Okafor = OW0 K AA1 F AO0 R\n');
    const ctx = resolveScriptContext(join(dir, 'a.rungs'), nodeFs);
    expect(rendered(ctx)).toEqual([]);
    expect(ctx.lexicon.map((o) => o.word)).toEqual(['okafor']);
  });

  it('refuses devices and pipes as config or lexicon files, without hanging', () => {
    symlinkSync('/dev/zero', join(dir, 'zero.lexicon'));
    writeFileSync(join(dir, '.rungs.json'), JSON.stringify({ lexicon: 'zero.lexicon' }));
    const ctx = resolveScriptContext(join(dir, 'a.rungs'), nodeFs);
    expect(rendered(ctx).map((p) => p.problem.message)).toEqual(['lexicon file "zero.lexicon" is outside the folder of the config file that names it (a lexicon must be in that folder or below it)']);
    execFileSync('mkfifo', [join(dir, 'pipe.lexicon')]);
    writeFileSync(join(dir, '.rungs.json'), JSON.stringify({ lexicon: 'pipe.lexicon' }));
    const ctx1 = resolveScriptContext(join(dir, 'a.rungs'), nodeFs);
    expect(rendered(ctx1).map((p) => p.problem.message)).toEqual(['lexicon file "pipe.lexicon" is not a regular file']);
    rmSync(join(dir, '.rungs.json'));
    execFileSync('mkfifo', [join(dir, '.rungs.yaml')]);
    const ctx2 = resolveScriptContext(join(dir, 'a.rungs'), nodeFs);
    expect(rendered(ctx2).map((p) => p.problem.message)).toEqual(['cannot read the config file (not a regular file)']);
  });

  it('reads at most the bound', () => {
    writeFileSync(join(dir, 'big.rungs'), Buffer.alloc(2048, 0x61));
    expect(readBytesBounded(join(dir, 'big.rungs'), 4096).length).toBe(2048);
    expect(() => readBytesBounded(join(dir, 'big.rungs'), 1024)).toThrow('larger than 1024 bytes');
    expect(() => readBytesBounded('/dev/zero')).toThrow('not a regular file');
    expect(MAX_FILE_BYTES).toBe(32 * 1024 * 1024);
  });

  it('reads a file that states no size to its end, growing the buffer, and still bounds it', () => {
    // /proc files state a size of 0 (Linux); this process's memory map runs to tens of kilobytes,
    // several times the first buffer, and every line must come through whole and in order.
    if (process.platform !== 'linux') return;
    const smaps = readBytesBounded('/proc/self/smaps').toString('latin1');
    expect(smaps.length).toBeGreaterThan(3 * 4096);
    expect(smaps.endsWith('\n')).toBe(true);
    for (const line of smaps.slice(0, -1).split('\n')) expect(line).toMatch(/^([0-9a-f]+-[0-9a-f]+ |[A-Za-z_]+:)/);
    expect(() => readBytesBounded('/proc/self/smaps', 10_000)).toThrow('larger than 10000 bytes');
  });

  it('quotes at most a short, escaped excerpt of what a file holds', () => {
    // A lexicon line whose "phones" are a long secret with a terminal escape in it.
    writeFileSync(join(dir, '.rungs.json'), JSON.stringify({ lexicon: 'names.lexicon' }));
    writeFileSync(join(dir, 'names.lexicon'), `word = \u001b]0;${'x'.repeat(500)}\n`);
    const msgs = rendered(resolveScriptContext(join(dir, 'a.rungs'), nodeFs)).map((p) => p.problem.message);
    expect(msgs.length).toBe(1);
    expect(msgs[0]).not.toContain('\u001b');
    expect(msgs[0]).toContain('\\x1b');
    expect(msgs[0].length).toBeLessThan(200);
    expect(excerpt('a\u2028b')).toBe('a\\u2028b');
  });
});

describe('spawned: nothing hangs', () => {
  it('a folder with link cycles and a pipe finishes', () => {
    writeFileSync(join(dir, 'a.rungs'), SCRIPT);
    symlinkSync('.', join(dir, 'l1'));
    symlinkSync('.', join(dir, 'l2'));
    execFileSync('mkfifo', [join(dir, 'p.rungs')]);
    // The timeout only guards the test run against a hang; it asserts no speed.
    const r = spawnSync(process.execPath, [join(root, 'server', 'bin', 'rungs.js'), 'lint', '.'], { cwd: dir, encoding: 'utf8', timeout: 30_000, env: { ...process.env, CI: 'true' } });
    expect(r.signal).toBeNull();
    expect(r.status).toBe(0);
    expect(r.stdout).toBe('1 file checked: no problems\n');
  });
});
