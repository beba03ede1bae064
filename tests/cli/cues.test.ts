// Cue tracks checked by independent parsers from the registry: webvtt-parser (a W3C WebVTT parser
// that also checks inner word timestamps) and srt-validator; the CSV read back with csv-parse.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse as parseCsv } from 'csv-parse/sync';
import { fc, test as fcTest } from '@fast-check/vitest';
import srtValidator from 'srt-validator';
import { WebVTTParser } from 'webvtt-parser';
import { describe, expect, it } from 'vitest';
import { renderSrt, renderVtt, renderWordCsv } from '../../server/src/core/cues';
import { planSession } from '../../server/src/core/timing';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { analyzeText } from '../helpers/data';
import { MemFs } from './memfs';

const root = join(__dirname, '..', '..');
const sample = (name: string) => readFileSync(join(root, 'sample-scripts', name), 'utf8');
// The full entity table shipped with webvtt-parser gives the spec's character references.
const entities = JSON.parse(readFileSync(join(root, 'node_modules/webvtt-parser/html-entities.json'), 'utf8'));

function parseVtt(text: string) {
  return new WebVTTParser(entities).parse(text, 'metadata');
}

async function run(argv: string[], fs: MemFs, extra: Partial<CliIO> = {}) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: '/clinic', fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env: {}, ...extra });
  return { code, out, err };
}

describe('WebVTT', () => {
  it('a sample rung passes the W3C parser with one timestamp per word after the first', () => {
    const a = analyzeText(sample('kitchen-sets.rungs'));
    const plan = planSession(a, { rung: 1 });
    const tree = parseVtt(renderVtt(plan, 'kitchen, rung 2'));
    expect(tree.errors).toEqual([]);
    expect(tree.cues).toHaveLength(plan.items.length);
    tree.cues.forEach((cue, k) => {
      const item = plan.items[k];
      expect(cue.id).toBe(`line ${item.line + 1}`);
      expect(cue.startTime).toBeCloseTo(item.start, 3);
      expect(cue.endTime).toBeCloseTo(item.end, 3);
      const stamps = cue.tree.children.filter((c) => c.type === 'timestamp').map((c) => c.value as number);
      expect(stamps).toHaveLength(item.words.length - 1);
      stamps.forEach((s, i) => expect(s).toBeCloseTo(item.words[i + 1].onset, 3));
      // The text between the tags is the item as written.
      const text = cue.tree.children.filter((c) => c.type === 'text').map((c) => c.value).join('');
      expect(text).toBe(item.text);
    });
  });

  it('item ids name their cues; echo mode adds response cues', () => {
    const plan = planSession(analyzeText(sample('morning-routine.rungs')), { rung: 0, mode: 'echo' });
    const tree = parseVtt(renderVtt(plan));
    expect(tree.errors).toEqual([]);
    expect(tree.cues.map((c) => c.id)).toContain('gm1');
    expect(tree.cues.filter((c) => c.id.endsWith(' response'))).toHaveLength(plan.items.length);
  });

  it('hostile item text stays text', () => {
    const plan = planSession(analyzeText('<b>Hi</b> & --> there <00:00:09.000>.\n'));
    const vtt = renderVtt(plan, 'note --> with arrow');
    const tree = parseVtt(vtt);
    expect(tree.errors).toEqual([]);
    const text = tree.cues[0].tree.children.filter((c) => c.type === 'text').map((c) => c.value).join('');
    expect(text).toBe(plan.items[0].text);
  });

  // Any words at any plausible pace give a valid track (property test with fast-check).
  fcTest.prop([
    fc.array(fc.array(fc.constantFrom('see', 'you', 'soon', 'banana', 'television', 'cat', 'afternoon,', 'please.'), { minLength: 1, maxLength: 8 }), { minLength: 1, maxLength: 5 }),
    fc.double({ min: 0.3, max: 6, noNaN: true }),
    fc.constantFrom('unison', 'echo'),
  ])('random items give valid WebVTT and SRT', (items, pace, mode) => {
    const a = analyzeText(`@paces ${pace.toFixed(2)}\n@phrase-pause 0.2\n${items.map((w) => w.join(' ')).join('\n')}\n`);
    const plan = planSession(a, { mode: mode as 'unison' | 'echo' });
    expect(parseVtt(renderVtt(plan)).errors).toEqual([]);
    expect(srtValidator(renderSrt(plan))).toEqual([]);
  });
});

describe('SRT and CSV', () => {
  it('SRT of every sample script passes srt-validator', () => {
    for (const name of ['morning-routine.rungs', 'kitchen-sets.rungs', 'family-visits-draft.rungs']) {
      const plan = planSession(analyzeText(sample(name)), { mode: 'echo' });
      expect(srtValidator(renderSrt(plan)), name).toEqual([]);
    }
  });

  it('the CSV lists every word with its start and end', () => {
    const plan = planSession(analyzeText('@paces 2\n@word-slots equal\n== Tea\nI want some tea, please.\n'));
    const rows: Record<string, string>[] = parseCsv(renderWordCsv(plan), { columns: true });
    // 5 words at 2 wps with equal slots: 0.5 s each (computed).
    expect(rows.map((r) => [r.word, r.start, r.end])).toEqual([
      ['I', '0', '0.5'],
      ['want', '0.5', '1'],
      ['some', '1', '1.5'],
      ['tea', '1.5', '2'],
      ['please', '2', '2.5'],
    ]);
    expect(rows[0].rung).toBe('Tea');
  });
});

describe('rungs cues', () => {
  const fs = () => new MemFs({ 'walt.rungs': sample('morning-routine.rungs') });

  it('writes WebVTT to standard output by default', async () => {
    const r = await run(['cues', 'walt.rungs', '--rung', 'Breakfast'], fs());
    expect(r.code).toBe(0);
    expect(parseVtt(r.out).errors).toEqual([]);
    expect(r.out).toMatch(/^WEBVTT\n\nNOTE Rungs cue track: walt.rungs, rung 2 "Breakfast" at 1 wps, unison\n/);
  });

  it('writes SRT and CSV files with -o and a forced pace', async () => {
    const m = fs();
    expect((await run(['cues', 'walt.rungs', '--rung', '1', '--pace', '2', '-f', 'srt', '-o', 'out.srt'], m)).code).toBe(0);
    expect(srtValidator(m.files.get('/clinic/out.srt')!)).toEqual([]);
    const r = await run(['cues', 'walt.rungs', '--format', 'csv', '-o', 'w.csv'], m);
    expect(r.err).toMatch(/wrote w.csv/);
    expect(m.files.get('/clinic/w.csv')!.split('\n')[0]).toBe('rung,item_line,item_id,word_index,word,start,end,syllables');
  });

  it('usage errors exit 2 with the reason', async () => {
    expect((await run(['cues', 'walt.rungs', '--rung', 'Supper'], fs())).err).toMatch(/no rung of that name/);
    expect((await run(['cues', 'walt.rungs', '--pace', '2 wpm'], fs())).code).toBe(2);
    expect((await run(['cues', 'walt.rungs', '--mode', 'chorus'], fs())).code).toBe(2);
    const missing = await run(['cues', 'nobody.rungs'], fs());
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/nobody.rungs: no such file or folder/);
  });
});
