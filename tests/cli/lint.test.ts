// `rungs lint` scenarios, in-process on an in-memory file system and as a spawned process.
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { MemFs } from './memfs';

const root = join(__dirname, '..', '..');
const sample = (name: string) => readFileSync(join(root, 'sample-scripts', name), 'utf8');

const CLEAN = '== One\nSee you soon.\nHi there.\nThank you.\n';
const WARN = '== One\nCome in.\nCome in.\nSit down.\n';
const ERROR = '@pacse 1 wps\n== One\nSee you soon.\nHi there.\nThank you.\n';

async function run(argv: string[], fs: MemFs, extra: Partial<CliIO> = {}) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: '/clinic', fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {}, ...extra });
  return { code, out, err };
}

describe('rungs lint, in-process', () => {
  it('reports in file and line order and exits 1 on an error', async () => {
    const fs = new MemFs({ 'b.rungs': WARN, 'a.rungs': ERROR, 'c/clean.rungs': CLEAN });
    const r = await run(['lint', '.'], fs);
    expect(r.code).toBe(1);
    expect(r.out).toBe(
      [
        'a.rungs:1:1 error unknown-key unknown setting "@pacse"; did you mean "@paces"?',
        'b.rungs:3:1 warning duplicate-item "Come in." repeats line 2 in rung 1 "One"',
        '',
        // The duplicate's fix is a quick fix only (batch: false), so only the unknown key counts.
        '2 problems (1 error, 1 warning, 0 info) in 2 of 3 files; 1 fixable with --fix',
        '',
      ].join('\n'),
    );
  });

  it('exits 0 on warnings, and 1 with more warnings than --max-warnings', async () => {
    const fs = new MemFs({ 'b.rungs': WARN });
    expect((await run(['lint', 'b.rungs'], fs)).code).toBe(0);
    expect((await run(['lint', 'b.rungs', '--max-warnings', '1'], fs)).code).toBe(0);
    const r = await run(['lint', 'b.rungs', '--max-warnings=0'], fs);
    expect(r.code).toBe(1);
    expect(r.err).toBe('rungs lint: 1 warnings, more than --max-warnings 0\n');
  });

  it('exits 2 on usage errors', async () => {
    const fs = new MemFs({ 'a.rungs': CLEAN });
    expect((await run(['lint'], fs)).code).toBe(2);
    expect((await run(['lint', 'a.rungs', '--format', 'xml'], fs)).code).toBe(2);
    expect((await run(['lint', 'a.rungs', '--max-warnings', 'lots'], fs)).code).toBe(2);
    expect((await run(['lint', 'a.rungs', '--fix', '--fix-dry-run'], fs)).code).toBe(2);
    expect((await run(['lint', '-', '--fix'], fs)).code).toBe(2);
  });

  it('still lints and reports the other files when one is unreadable or missing, and exits 2', async () => {
    const fs = new MemFs({ 'a.rungs': ERROR, 'z.rungs': WARN });
    fs.unreadable.add('/clinic/locked.rungs');
    const r = await run(['lint', 'a.rungs', 'locked.rungs', 'missing.rungs', 'z.rungs'], fs);
    expect(r.code).toBe(2);
    expect(r.err).toContain('rungs lint: missing.rungs: no such file or folder');
    expect(r.err).toContain('rungs lint: locked.rungs:1:1: cannot read the file (EACCES)');
    expect(r.out).toContain('a.rungs:1:1 error unknown-key');
    expect(r.out).toContain('z.rungs:3:1 warning duplicate-item');
  });

  it('expands globs and honours .gitignore when searching folders', async () => {
    const fs = new MemFs({
      '.git/HEAD': 'ref',
      '.gitignore': 'drafts/\n*.old.rungs\n',
      'lib/a.rungs': ERROR,
      'lib/a.old.rungs': ERROR,
      'lib/deep/b.rungs': WARN,
      'drafts/c.rungs': ERROR,
      'node_modules/x/d.rungs': ERROR,
      '.hidden/e.rungs': ERROR,
    });
    const all = await run(['lint', '--format', 'json', '.'], fs);
    expect(JSON.parse(all.out).map((f: { file: string }) => f.file)).toEqual(['lib/a.rungs', 'lib/deep/b.rungs']);
    const glob = await run(['lint', '--format', 'json', 'lib/**/b.rungs', 'lib/*.rungs'], fs);
    expect(JSON.parse(glob.out).map((f: { file: string }) => f.file)).toEqual(['lib/a.rungs', 'lib/deep/b.rungs']);
    const named = await run(['lint', '--format', 'json', 'drafts/c.rungs'], fs);
    expect(JSON.parse(named.out).map((f: { file: string }) => f.file)).toEqual(['drafts/c.rungs']);
    const none = await run(['lint', 'nothing/**/*.rungs'], fs);
    expect(none.code).toBe(2);
  });

  it('reads standard input with "-" and uses the working folder\'s config', async () => {
    const fs = new MemFs({ '.rungs.json': '{ "rules": { "duplicate-item": "error" } }' });
    const r = await run(['lint', '-'], fs, { readStdin: () => WARN });
    expect(r.code).toBe(1);
    expect(r.out).toContain('<stdin>:3:1 error duplicate-item');
  });

  it('reports config problems under the config file, once', async () => {
    const fs = new MemFs({ '.rungs.yaml': 'rules:\n  thin-rungs: off\n', 'a.rungs': CLEAN, 'b.rungs': CLEAN });
    const r = await run(['lint', '.'], fs);
    expect(r.code).toBe(1);
    expect(r.out.split('\n').filter((l) => l.includes('bad-config'))).toEqual([
      '.rungs.yaml:2:3 error bad-config unknown rule "thin-rungs"; did you mean "thin-rung"?',
    ]);
  });

  it('--fix rewrites files and reports what is left; --fix-dry-run prints a diff and writes nothing', async () => {
    const fs = new MemFs({ 'a.rungs': `@pacse 1 wps\n${WARN}` });
    const dry = await run(['lint', '--fix-dry-run', 'a.rungs'], fs);
    expect(dry.out).toBe(['--- a/a.rungs', '+++ b/a.rungs', '@@ -1,4 +1,4 @@', '-@pacse 1 wps', '+@paces 1 wps', ' == One', ' Come in.', ' Come in.', ''].join('\n'));
    expect(fs.writes).toEqual([]);
    const r = await run(['lint', '--fix', 'a.rungs'], fs);
    expect(r.code).toBe(0);
    expect(fs.files.get('/clinic/a.rungs')).toBe(`@paces 1 wps\n${WARN}`);
    expect(r.out).toBe('a.rungs:4:1 warning duplicate-item "Come in." repeats line 3 in rung 1 "One"\n\n1 problem (0 errors, 1 warning, 0 info) in 1 of 1 file\n');
  });

  it('--fix never removes a repeated item or writes an estimate as an override', async () => {
    // duplicate-item and estimated-word fixes are quick fixes only: nothing for --fix to do.
    const text = '== One\nCome in.\nCome in.\nTeodric is here.\n';
    const fs = new MemFs({ 'a.rungs': text });
    const dry = await run(['lint', '--fix-dry-run', 'a.rungs'], fs);
    expect(dry.out).toBe('');
    const r = await run(['lint', '--fix', 'a.rungs'], fs);
    expect(fs.writes).toEqual([]);
    expect(fs.files.get('/clinic/a.rungs')).toBe(text);
    expect(r.out.split('\n').filter((l) => l.includes(' warning ')).map((l) => l.split(' ')[2])).toEqual(['duplicate-item', 'estimated-word']);
    expect(r.out).toContain('\n2 problems (0 errors, 2 warnings, 0 info) in 1 of 1 file\n');
    expect(r.out).not.toContain('fixable');
    // JSON output marks those fixes so tools do not apply them in bulk either.
    const json = JSON.parse((await run(['lint', '--format', 'json', 'a.rungs'], fs)).out);
    expect(json[0].problems.map((p: { rule: string; fix?: { batch?: boolean } }) => `${p.rule} ${p.fix?.batch}`)).toEqual(['duplicate-item false', 'estimated-word false']);
  });

  it('--quiet reports errors only', async () => {
    const fs = new MemFs({ 'a.rungs': ERROR, 'b.rungs': WARN });
    const r = await run(['lint', '--quiet', '.'], fs);
    expect(r.out).toContain('unknown-key');
    expect(r.out).not.toContain('duplicate-item');
  });

  it('--quiet hides warnings but still counts them for --max-warnings', async () => {
    const fs = new MemFs({ 'b.rungs': WARN });
    const r = await run(['lint', '--quiet', '--max-warnings', '0', 'b.rungs'], fs);
    expect(r.code).toBe(1);
    expect(r.out).toBe('1 file checked: no problems\n');
    expect(r.err).toBe('rungs lint: 1 warnings, more than --max-warnings 0\n');
    expect((await run(['lint', '--quiet', 'b.rungs'], fs)).code).toBe(0);
  });

  it('colours only on a terminal and shows progress only on a terminal outside CI', async () => {
    const files: Record<string, string> = {};
    for (let i = 0; i < 12; i++) files[`s${String(i).padStart(2, '0')}.rungs`] = WARN;
    const fs = new MemFs(files);
    const tty = await run(['lint', '.'], fs, { isTTY: true });
    expect(tty.out).toContain('\u001b[33mwarning\u001b[0m');
    expect(tty.err).toContain('\rrungs lint: 12/12 files');
    const ci = await run(['lint', '.'], fs, { isTTY: true, env: { CI: 'true' } });
    expect(ci.err).toBe('');
    const quiet = await run(['lint', '--quiet', '.'], fs, { isTTY: true });
    expect(quiet.err).toBe('');
    const pipe = await run(['lint', '.'], fs);
    expect(pipe.out).not.toContain('\u001b[');
    expect(pipe.err).toBe('');
  });

  it('writes GitHub annotations', async () => {
    const fs = new MemFs({ 'a,b.rungs': WARN });
    const r = await run(['lint', '--format', 'github', '.'], fs);
    expect(r.out).toBe('::warning file=a%2Cb.rungs,line=3,col=1,endLine=3,endColumn=9,title=rungs duplicate-item::"Come in." repeats line 2 in rung 1 "One"\n');
  });

  it('gives the same whole result for the sample scripts every time (snapshot)', async () => {
    const fs = new MemFs({
      'sample-scripts/family-visits-draft.rungs': sample('family-visits-draft.rungs'),
      'sample-scripts/kitchen-sets.rungs': sample('kitchen-sets.rungs'),
      'sample-scripts/morning-routine.rungs': sample('morning-routine.rungs'),
    });
    const text = await run(['lint', 'sample-scripts'], fs);
    expect(text.code).toBe(1);
    expect(text.out).toMatchSnapshot();
    const json = await run(['lint', '--format', 'json', 'sample-scripts'], fs);
    expect(JSON.parse(json.out)).toMatchSnapshot();
    const again = await run(['lint', '--format', 'json', 'sample-scripts'], fs);
    expect(again.out).toBe(json.out);
  });
});

describe('rungs lint, spawned', () => {
  it('reports the demo script\'s planted problems with exact numbers and exits 1', () => {
    const r = spawnSync(process.execPath, [join(root, 'server', 'bin', 'rungs.js'), 'lint', 'sample-scripts'], { cwd: root, encoding: 'utf8', env: { ...process.env, CI: 'true' } });
    expect(r.status).toBe(1);
    expect(r.stderr).toBe('');
    const lines = r.stdout.split('\n');
    for (const want of [
      'sample-scripts/family-visits-draft.rungs:8:1 error unknown-key unknown setting "@pacse"; did you mean "@paces"?',
      'sample-scripts/family-visits-draft.rungs:37:1 warning step-backwards rung 4 "Back to short" median 21.7 is 15.0 below rung 3 "Longer greetings" (36.7); a rising ladder should not step back',
      'sample-scripts/family-visits-draft.rungs:42:1 warning step-too-big rung 5 "Stories" median 79.4 is 57.7 above rung 4 "Back to short" (21.7); largest step is 12 (@max-step)',
      'sample-scripts/family-visits-draft.rungs:42:1 warning thin-rung rung 5 "Stories" has 2 items; rungs need at least 3 (@min-items)',
    ]) expect(lines).toContain(want);
    // The kitchen script's only findings are its sets: 9 and 8 items cannot show equivalence.
    expect(lines.filter((l) => l.includes('kitchen-sets.rungs:') && !l.includes(' unmatched-sets '))).toEqual([]);
    expect(r.stdout).not.toContain('morning-routine.rungs:');
  });

  it('exits 0 on the clean sample scripts', () => {
    const r = spawnSync(process.execPath, [join(root, 'server', 'bin', 'rungs.js'), 'lint', 'sample-scripts/kitchen-sets.rungs', 'sample-scripts/morning-routine.rungs'], { cwd: root, encoding: 'utf8' });
    expect(r.status).toBe(0);
    // Sets of 9 and 8 items are too small to show equivalence within ±0.5 SD on any metric
    // (a 90 % CI half-width near 0.85 SD): seven warnings, one per metric, and nothing else.
    const lines = r.stdout.trimEnd().split('\n');
    expect(lines.filter((l) => l.includes(' warning unmatched-sets '))).toHaveLength(7);
    expect(lines.at(-1)).toBe('7 problems (0 errors, 7 warnings, 0 info) in 1 of 2 files');
  });

  // A reader that stops early (`rungs lint | head -c 200`): the output is far larger than a pipe
  // holds, so the CLI's later writes fail with EPIPE once the reader has closed its end.
  function closeEarly(args: string[], input: string): Promise<{ code: number | null; stderr: string; got: number }> {
    return new Promise((done, fail) => {
      const child = spawn(process.execPath, [join(root, 'server', 'bin', 'rungs.js'), ...args], { cwd: root, env: { ...process.env, CI: 'true' } });
      let stderr = '';
      let got = 0;
      child.stderr.setEncoding('utf8').on('data', (t: string) => (stderr += t));
      child.stdout.once('data', (chunk: Buffer) => {
        got = chunk.length;
        child.stdout.destroy();
      });
      child.on('error', fail);
      child.on('close', (code) => done({ code, stderr, got }));
      child.stdin.end(input);
    });
  }

  // 4000 repeats of one item: 3999 duplicate-item warnings (exit 0), some 250 kB of text.
  const MANY = `== One\n${'Come in.\n'.repeat(4000)}`;

  it('exits quietly with its own exit code when the reader closes the pipe early (lint)', async () => {
    const r = await closeEarly(['lint', '-'], MANY);
    expect(r.got).toBeGreaterThan(0);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
  });

  it('exits quietly with its own exit code when the reader closes the pipe early (score)', async () => {
    const r = await closeEarly(['score', '--format', 'json', '-'], MANY);
    expect(r.got).toBeGreaterThan(0);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
  });
});
