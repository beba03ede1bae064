// `rungs progress`, in-process on an in-memory file system: formats, exit codes, script lookup
// relative to the records file, config-file settings, the --client filter.
import { describe, expect, it } from 'vitest';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { MemFs } from '../cli/memfs';

const SCRIPT = '@paces 1, 1.5 wps\n== Short\nHi there.\nSee you soon.\n== Long\nThank you for coming today.\n';
const RECORDS = [
  'date,client,script,rung,condition,words,seconds',
  '2026-03-02,C-0417,,,unassisted,10,10',
  '2026-03-02,C-0417,../scripts/a.rungs,Short,paced,12,10',
  '2026-03-09,C-0417,../scripts/a.rungs,Short,paced,14,10',
  '2026-03-02,C-0090,,,unassisted,8,10',
  '2026-03-02,C-0090,../scripts/a.rungs,2,paced,9,10',
].join('\n');

async function run(argv: string[], fs: MemFs, extra: Partial<CliIO> = {}) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: '/clinic', fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {}, ...extra });
  return { code, out, err };
}

describe('rungs progress', () => {
  const fs = () => new MemFs({ 'scripts/a.rungs': SCRIPT, 'records/clinic.rates.csv': RECORDS, 'records/notes.csv': 'not records' });

  it('prints the documented JSON with 1-based lines and exits 0 on a clean file', async () => {
    const r = await run(['progress', 'records', '--format', 'json'], fs());
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.benefitMark).toBe(1.2);
    expect(j.files).toHaveLength(1); // notes.csv does not match *.rates.csv
    const f = j.files[0];
    expect(f.file).toBe('records/clinic.rates.csv');
    // computed: 12/10 = 1.2 w/s over 10/10 = 1.0 w/s: ratio 1.2, at the mark; pace kept 1.2/1 = 1.2.
    expect(f.records[1]).toEqual({
      line: 3, date: '2026-03-02', client: 'C-0417', script: '../scripts/a.rungs', rung: 'Short', condition: 'paced',
      words: 12, wordsFromTranscript: false, fillersLeftOut: [], seconds: 10, pace: '1 wps', wps: 1.2, sps: null, ratio: 1.2,
      baselineFrom: '2026-03-02', baselineWps: 1, benefit: true, paceKept: 1.2, accuracy: null,
    });
    // computed: C-0090 9/10 = 0.9 over 8/10 = 0.8: 1.125, below the mark.
    expect(f.records[4]).toMatchObject({ rung: 'Long', ratio: 1.125, benefit: false });
    expect(f.trends.map((t: { client: string; rung: string; ratios: number[]; slopePerWeek: number | null; ready: boolean }) => [t.client, t.rung, t.ratios, t.slopePerWeek, t.ready])).toEqual([
      ['C-0090', 'Long', [1.125], null, false],
      ['C-0417', 'Short', [1.2, 1.4], 0.2, true],
    ]);
    expect(f.problems).toEqual([]);
    expect(j.caution).toMatch(/^Caution: /);
  });

  it('filters by client and prints a table with the trend note and the caution', async () => {
    const r = await run(['progress', 'records/clinic.rates.csv', '--client', 'C-0417'], fs());
    expect(r.code).toBe(0);
    expect(r.out).not.toContain('C-0090');
    expect(r.out).toContain('1.2 ✓ (vs 1 w/s, same day)');
    expect(r.out).toContain('1.4 ✓ (vs 1 w/s, 2026-03-02)');
    expect(r.out).toContain('C-0417 · ../scripts/a.rungs · Short: ratios 1.2, 1.4 · +0.2/week · meets the mark in the last 2 sessions; consider the next rung');
    expect(r.out).toContain('Caution: ');
  });

  it('reads the benefit mark from a config file beside the records', async () => {
    const f = fs();
    f.files.set('/clinic/records/.rungs.json', '{ "benefit-mark": 1.1 }');
    const j = JSON.parse((await run(['progress', 'records', '-f', 'json'], f)).out);
    expect(j.benefitMark).toBe(1.1);
    expect(j.files[0].records[4].benefit).toBe(true);
  });

  it('exits 1 on a bad row, naming file, line and column, and still reports the rest', async () => {
    const f = fs();
    f.files.set('/clinic/records/clinic.rates.csv', `${RECORDS}\n2026-03-10,C-0417,../scripts/a.rungs,Middle,paced,12,10`);
    const r = await run(['progress', 'records'], f);
    expect(r.code).toBe(1);
    expect(r.out).toContain('records/clinic.rates.csv:7:38 error bad-record "../scripts/a.rungs" has no rung "Middle"');
    expect(r.out).toContain('records/clinic.rates.csv: 5 of 6 rows read');
    const csv = await run(['progress', 'records', '--format', 'csv'], f);
    expect(csv.code).toBe(1);
    expect(csv.err).toContain('records/clinic.rates.csv:7:38 error bad-record');
    expect(csv.out.split('\n')[0]).toBe('file,line,date,client,script,rung,condition,words,seconds,pace,wps,ratio,baseline_from,benefit,pace_kept,accuracy');
    expect(csv.out.split('\n')[3]).toBe('records/clinic.rates.csv,4,2026-03-09,C-0417,../scripts/a.rungs,Short,paced,14,10,1 wps,1.4,1.4,2026-03-02,yes,1.4,');
  });

  it('exits 2 on usage errors and missing files', async () => {
    expect((await run(['progress'], fs())).code).toBe(2);
    expect((await run(['progress', 'nothing.rates.csv'], fs())).code).toBe(2);
    expect((await run(['progress', 'scripts'], fs())).err).toBe('rungs progress: no *.rates.csv or *.rates.tsv files found\n');
    expect((await run(['progress', 'records', '--format', 'xml'], fs())).code).toBe(2);
  });
});
