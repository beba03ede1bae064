// The records index behind a script's rung hover (server/src/lsp/recordsIndex.ts), with the file
// system counted: a repeated hover reads no file; a watched-file event makes it read that file
// (and only that one) again; an open document's text wins over the disk and its edits are seen at
// once. The ratios are computed by hand from the rows below.
import { describe, expect, it } from 'vitest';
import { RecordsIndex, type RecordsFiles } from '../../server/src/lsp/recordsIndex';

const SCRIPT = '@paces 1 wps\n== Short\nHi there.\n== Long\nThank you for coming today.\n';
const rows = (paced: string) => ['date,client,script,rung,condition,words,seconds', '2026-03-02,C-0417,,,unassisted,10,10', paced, ''].join('\n');

function setup() {
  const disk = new Map<string, string>([
    ['/w/a.rungs', SCRIPT],
    // computed: 12 words in 10 s = 1.2 words/s over 10 / 10 = 1.0 unassisted: ratio 1.2.
    ['/w/clinic.rates.csv', rows('2026-03-02,C-0417,a.rungs,Short,paced,12,10')],
  ]);
  const reads: string[] = [];
  let finds = 0;
  const files: RecordsFiles = {
    read: (p) => (reads.push(p), disk.get(p) ?? null),
    find: () => (finds++, [...disk.keys()].filter((p) => p.endsWith('.rates.csv'))),
  };
  const open = new Map<string, string>();
  const index = new RecordsIndex(files, (p) => open.get(p), () => '2026-03-20');
  const note = (rung = 0) => index.note('/w/a.rungs', rung, ['/w'], undefined).join('\n');
  return { disk, reads, open, index, note, finds: () => finds };
}

describe('the rung hover records index', () => {
  it('reads each file once; a repeated hover reads nothing', () => {
    const t = setup();
    expect(t.note()).toContain('- C-0417 · 2026-03-02: 1.2 (meets 1.2)');
    expect(t.reads.sort()).toEqual(['/w/a.rungs', '/w/clinic.rates.csv']);
    t.reads.length = 0;
    expect(t.note()).toContain('- C-0417 · 2026-03-02: 1.2 (meets 1.2)');
    expect(t.note(1)).toBe('');
    expect(t.reads).toEqual([]);
    expect(t.finds()).toBe(1);
  });

  it('reads a changed records file again after a watched-file event, and only that file', () => {
    const t = setup();
    t.note();
    t.reads.length = 0;
    // computed: 15 words in 10 s = 1.5 words/s over 1.0: ratio 1.5.
    t.disk.set('/w/clinic.rates.csv', rows('2026-03-02,C-0417,a.rungs,Short,paced,15,10'));
    expect(t.note()).toContain(': 1.2 (meets 1.2)');
    t.index.changed(['/w/clinic.rates.csv']);
    expect(t.note()).toContain('- C-0417 · 2026-03-02: 1.5 (meets 1.2)');
    expect(t.reads).toEqual(['/w/clinic.rates.csv']);
    // A records file was reported, so the list of records files is looked for again.
    expect(t.finds()).toBe(2);
  });

  it('a new records file is found after its creation is reported', () => {
    const t = setup();
    t.note();
    // computed: 9 words in 10 s over 1.0: ratio 0.9, below the mark of 1.2.
    t.disk.set('/w/home.rates.csv', rows('2026-03-05,C-0521,a.rungs,Short,paced,9,10').replace('C-0417', 'C-0521'));
    expect(t.note()).not.toContain('C-0521');
    t.index.changed(['/w/home.rates.csv']);
    expect(t.note()).toContain('- C-0521 · 2026-03-05: 0.9 (below 1.2)');
  });

  it("an open document wins over the disk, and its edits are seen without a read", () => {
    const t = setup();
    t.note();
    t.reads.length = 0;
    // computed: 18 words in 10 s over 1.0: ratio 1.8.
    t.open.set('/w/clinic.rates.csv', rows('2026-03-02,C-0417,a.rungs,Short,paced,18,10'));
    expect(t.note()).toContain(': 1.8 (meets 1.2)');
    // The script renamed its rung in the editor: the records no longer name a rung of it.
    t.open.set('/w/a.rungs', SCRIPT.replace('Short', 'Brief'));
    expect(t.note()).toBe('');
    expect(t.reads).toEqual([]);
  });

  it('reset forgets every copy (settings or config files changed)', () => {
    const t = setup();
    t.note();
    t.reads.length = 0;
    t.index.reset();
    t.note();
    expect(t.reads.sort()).toEqual(['/w/a.rungs', '/w/clinic.rates.csv']);
  });
});
