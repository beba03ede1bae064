// `rungs score`: the JSON schema, CSV, the table, exit codes and bad input, run in-process on a
// fake file system and once as a spawned process.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../server/src/cli/main';
import type { CliFs, CliIO } from '../../server/src/cli/io';

function fakeFs(files: Record<string, string>): CliFs {
  const dirs = new Set<string>();
  for (const f of Object.keys(files)) {
    let d = f;
    while ((d = d.slice(0, d.lastIndexOf('/'))) && d.length > 0) dirs.add(d);
  }
  return {
    readFile: (p) => {
      if (!(p in files)) throw Object.assign(new Error('ENOENT'), { code: 'ENOENT' });
      if (files[p] === '\u0000EACCES') throw Object.assign(new Error('EACCES'), { code: 'EACCES' });
      return files[p];
    },
    writeFile: (p, t) => {
      files[p] = t;
    },
    isDirectory: (p) => dirs.has(p),
    exists: (p) => p in files || dirs.has(p),
    readdir: (p) => [...new Set(Object.keys(files).filter((f) => f.startsWith(`${p}/`)).map((f) => f.slice(p.length + 1).split('/')[0]))],
  };
}

async function run(argv: string[], files: Record<string, string>, stdin = '') {
  let out = '';
  let err = '';
  const io: CliIO = { argv, cwd: '/w', fs: fakeFs(files), stdout: (t) => (out += t), stderr: (t) => (err += t), readStdin: () => stdin };
  const code = await main(io);
  return { code, out, err };
}

describe('rungs score --format json', () => {
  it('gives the documented schema for a file of bare sentences', async () => {
    const r = await run(['score', '--format', 'json', 'plain.txt'], {
      '/w/plain.txt': 'My granddaughter visits every Sunday afternoon.\nThank you.\n',
    });
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(['file', 'title', 'paces', 'baseline', 'sessionSeconds', 'rungs', 'problems', 'caution']);
    // Session with the default 2 s gap (computed): 6 + 2 + 2 = 10 s at 1 wps; 4 + 2 + 1.33 at 1.5 wps.
    expect(j.sessionSeconds).toEqual({ '1 wps': 10, '1.5 wps': 7.33, '2 wps': 6 });
    expect(j.rungs[0].sessionSeconds).toEqual(j.sessionSeconds);
    expect(j.caution).toMatch(/support clinical judgement; they are not a diagnosis and defer to the treating clinician/);
    expect(j.file).toBe('plain.txt');
    expect(j.rungs).toHaveLength(1);
    expect(j.rungs[0]).toMatchObject({ name: 'Items', line: 1, paces: ['1 wps', '1.5 wps', '2 wps'] });
    const item = j.rungs[0].items[0];
    for (const k of ['line', 'text', 'words', 'syllables', 'phonemes', 'wcm', 'zipfMean', 'zipfMin', 'difficulty', 'durations']) {
      expect(item).toHaveProperty(k);
    }
    // Computed from the CMU Pronouncing Dictionary (npm cmu-pronouncing-dictionary@3.0.0): 6 words,
    // 14 syllables; 6 s at 1 wps, 4 s at 1.5 wps (words / pace).
    expect(item).toMatchObject({ line: 1, words: 6, syllables: 14 });
    expect(item.durations).toEqual({ '1 wps': 6, '1.5 wps': 4, '2 wps': 3 });
    // Only the informational "not in difficulty order" note: a plain list is not held to ladder rules.
    expect(j.problems.map((p: { rule: string; severity: string }) => `${p.severity} ${p.rule}`)).toEqual(['info unsorted-rung']);
  });

  it('reports problems with 1-based line and column', async () => {
    const r = await run(['score', '-f', 'json', 's.rungs'], { '/w/s.rungs': 'Hello.\n@pacse 1 wps\n' });
    const j = JSON.parse(r.out);
    const p = j.problems.find((x: { rule: string }) => x.rule === 'unknown-key');
    expect(p).toMatchObject({ line: 2, column: 1, severity: 'error' });
  });

  it('gives each pace its ratio to the baseline and the reading-aloud flag', async () => {
    const r = await run(['score', '-f', 'json', 'p.rungs'], { '/w/p.rungs': '@paces 0.96, 3.2 wps, 4 sps\n@baseline 0.8 wps\nThank you.\n' });
    const facts = JSON.parse(r.out).rungs[0].paceFacts;
    // 0.96 / 0.8 = 1.2: the 20 % gain used as the mark of a meaningful benefit (common practice).
    expect(facts['0.96 wps']).toEqual({ baselineRatio: 1.2, aboveReadingNorm: false });
    // 3.2 words/s is above adult reading aloud, 183 wpm = 3.05 words/s (Brysbaert 2019).
    expect(facts['3.2 wps']).toEqual({ baselineRatio: 4, aboveReadingNorm: true });
    expect(facts['4 sps']).toEqual({ baselineRatio: null, aboveReadingNorm: null });
  });

  it('reads standard input with "-"', async () => {
    const r = await run(['score', '--format=json', '-'], {}, 'Thank you.\n');
    expect(JSON.parse(r.out).rungs[0].items[0]).toMatchObject({ text: 'Thank you.', words: 2 });
  });
});

describe('rungs score, other formats and errors', () => {
  it('CSV has one row per item with quoted text where needed', async () => {
    const r = await run(['score', '--format', 'csv', 'a.rungs'], { '/w/a.rungs': 'Pass the bread, please.\n' });
    const rows = r.out.trim().split('\n');
    expect(rows).toHaveLength(2);
    expect(rows[0].startsWith('file,rung,line,id,sets,text,words,syllables')).toBe(true);
    expect(rows[1]).toContain('"Pass the bread, please."');
  });

  it('CSV cells that a spreadsheet would run as a formula are escaped', async () => {
    // OWASP "CSV Injection": cells starting with = + - @ are formulas in spreadsheets (common practice).
    const r = await run(['score', '--format', 'csv', 'a.rungs'], { '/w/a.rungs': '+1 for tea.\n=SUM(2, 3) cups.\n' });
    const rows = r.out.trim().split('\n');
    expect(rows[1]).toContain(",'+1 for tea.,");
    expect(rows[2]).toContain(`,"'=SUM(2, 3) cups.",`);
  });

  it('the table has rung headers, aligned rows and the caution', async () => {
    const r = await run(['score', 'a.rungs'], { '/w/a.rungs': '== One\nThank you.\nGood morning.\n' });
    expect(r.out).toContain('== One (line 1): 2 items');
    expect(r.out).toMatch(/Caution: these scores and timings support clinical judgement/);
  });

  it('exit 2 with a clear message for usage errors and unreadable files; other files still scored', async () => {
    expect((await run(['score'], {})).code).toBe(2);
    const bad = await run(['score', '--format', 'xml', 'a.rungs'], { '/w/a.rungs': 'Hi.\n' });
    expect(bad.code).toBe(2);
    expect(bad.err).toContain('--format must be one of table, csv, json, not "xml"');
    const r = await run(['score', '-f', 'json', 'missing.rungs', 'locked.rungs', 'ok.rungs'], {
      '/w/locked.rungs': '\u0000EACCES',
      '/w/ok.rungs': 'Thank you.\n',
    });
    expect(r.code).toBe(2);
    expect(r.err).toContain('missing.rungs: no such file or folder');
    expect(r.err).toContain('locked.rungs:1:1: cannot read the file (EACCES)');
    expect(JSON.parse(r.out).file).toBe('ok.rungs');
  });

  it('folders are searched for *.rungs files in a stable order', async () => {
    const r = await run(['score', '-f', 'json', 'lib'], {
      '/w/lib/b.rungs': 'Thank you.\n',
      '/w/lib/a.rungs': 'Good morning.\n',
      '/w/lib/notes.txt': 'not a script\n',
    });
    expect(JSON.parse(r.out).map((f: { file: string }) => f.file)).toEqual(['lib/a.rungs', 'lib/b.rungs']);
  });
});

describe('the installed command', () => {
  it('`rungs score` runs as a process on a sample script', () => {
    const root = join(__dirname, '..', '..');
    const r = spawnSync(process.execPath, [join(root, 'server/bin/rungs.js'), 'score', '--format', 'json', 'sample-scripts/morning-routine.rungs'], { cwd: root, encoding: 'utf8' });
    expect(r.stderr).toBe('');
    const j = JSON.parse(r.stdout);
    expect(j.title).toBe('Morning routine, weeks 1-4');
    expect(j.rungs.map((x: { name: string }) => x.name)).toEqual(['Greetings', 'Breakfast', 'Getting ready', 'Plans for the day']);
  });
});
