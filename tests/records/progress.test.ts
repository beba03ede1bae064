// Rate records: worked examples computed by hand, the exact 1.2 boundary, every bad-row kind
// with its line and column, delimiter/BOM/CRLF variants, transcript counts against the project's
// tokeniser, and the trend slope against jstat. Check values name their source beside them.
import fc from 'fast-check';
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { defaultOptions, applySettings } from '../../server/src/core/options';
import { parseScript } from '../../server/src/core/parse';
import { renderFindings } from '../../server/src/rules/index';
import { scriptFacts, type ProgressResult, type ScriptLookup } from '../../server/src/core/records';
import { readProgress } from '../../server/src/rules/records';
import { tokenize } from '../../server/src/core/tokenize';
import { words } from '../helpers/data';

const SCRIPT = ['@title Test ladder', '@paces 1, 1.5 wps', '== Short', 'Hi there.', 'See you soon.', '== Long', '@pace 2 wps', 'Thank you for coming today.'].join('\n');
const BASELINED = ['@baseline 0.8 wps', '== Only', 'Good morning.'].join('\n');
const SCRIPTS: Record<string, string> = { 's.rungs': SCRIPT, 'sub/b.rungs': BASELINED };
const lookup: ScriptLookup = (p) => (SCRIPTS[p] !== undefined ? scriptFacts(SCRIPTS[p]) : null);
const TODAY = '2026-12-02';
const HEAD = 'date,client,script,rung,condition,words,seconds,pace,correct';

function run(lines: string[], extra: Partial<Parameters<typeof readProgress>[0]> = {}): ProgressResult {
  return readProgress({ text: lines.join('\n'), scripts: lookup, today: TODAY, ...extra });
}
/** Problems as "line:column message-start" with 1-based positions, as the CLI prints them. */
const where = (r: ProgressResult) => r.problems.map((p) => `${p.line + 1}:${p.character + 1} ${p.rule}`);

describe('worked examples (computed by hand)', () => {
  const r = run([
    HEAD,
    '2026-03-02,C-0417,,,unassisted,10,10,,',
    '2026-03-02,C-0417,s.rungs,Short,paced,12,10,,',
    '2026-03-09,C-0417,s.rungs,1,paced,14,10,1.5,13',
  ]);

  it('reads every row and reports nothing', () => {
    expect(r.problems).toEqual([]);
    expect(r.records.map((x) => x.line)).toEqual([1, 2, 3]);
  });

  it('words per second and the ratio to the same day\'s unassisted rate', () => {
    // computed: 10 words / 10 s = 1.0 w/s; 12 / 10 = 1.2 w/s; 1.2 / 1.0 = 1.2, meets the 1.2 mark.
    expect(r.records[0]).toMatchObject({ condition: 'unassisted', wps: 1, ratio: null, benefit: null });
    expect(r.records[1]).toMatchObject({ wps: 1.2, ratio: 1.2, benefit: true, rungName: 'Short', paceFrom: 'rung' });
    expect(r.records[1].baseline).toEqual({ from: 'same-day', date: '2026-03-02', lines: [1], wps: 1 });
    // computed: the rung's first pace is 1 wps, so the pace kept is 1.2 / 1 = 1.2.
    expect(r.records[1].paceKept).toBeCloseTo(1.2, 12);
  });

  it('falls back to the latest earlier day, and uses the row\'s own pace and accuracy', () => {
    // computed: no unassisted row on 03-09, so 03-02's 1.0 w/s: ratio 1.4 / 1.0 = 1.4;
    // pace kept 1.4 / 1.5 = 0.9333; accuracy 13 / 14 = 0.9286.
    const x = r.records[2];
    expect(x.baseline).toMatchObject({ from: 'earlier-day', date: '2026-03-02' });
    expect(x.ratio).toBeCloseTo(1.4, 12);
    expect(x.benefit).toBe(true);
    expect(x.pace?.label).toBe('1.5 wps');
    expect(x.paceKept).toBeCloseTo(1.4 / 1.5, 12);
    expect(x.accuracy).toBeCloseTo(13 / 14, 12);
  });

  it('makes one trend per client and rung, with the slope per week and a readiness note', () => {
    expect(r.trends).toHaveLength(1);
    const t = r.trends[0];
    expect(t).toMatchObject({ client: 'C-0417', script: 's.rungs', rung: 'Short', atMark: 2, ready: true });
    expect(t.ratios[0]).toBe(1.2);
    expect(t.ratios[1]).toBeCloseTo(1.4, 12);
    // computed: (1.4 - 1.2) over 7 days = 0.2 per week.
    expect(t.slopePerWeek).toBeCloseTo(0.2, 12);
    expect(t.note).toBe('meets the mark in the last 2 sessions; consider the next rung');
  });

  it('pools several unassisted rows of a day as total words over total seconds', () => {
    // computed: (10 + 5) words / (10 + 15) s = 0.6 w/s (not the mean of 1.0 and 0.333);
    // paced 9 / 10 = 0.9 w/s; ratio 0.9 / 0.6 = 1.5.
    const p = run([HEAD, '2026-03-02,C-0417,,,unassisted,10,10,,', '2026-03-02,C-0417,,,unassisted,5,15,,', '2026-03-02,C-0417,s.rungs,Short,paced,9,10,,']);
    expect(p.records[2].baseline).toMatchObject({ from: 'same-day', lines: [1, 2], wps: 0.6 });
    expect(p.records[2].ratio).toBeCloseTo(1.5, 12);
  });

  it('uses the script\'s @baseline when the client has no unassisted row, and says when there is none', () => {
    // computed: 12 / 10 = 1.2 w/s against @baseline 0.8 w/s = 1.5.
    const b = run([HEAD, '2026-03-02,C-0417,sub/b.rungs,Only,paced,12,10,,', '2026-03-02,C-0417,s.rungs,Short,paced,12,10,,']);
    expect(b.records[0].baseline).toEqual({ from: 'script', wps: 0.8 });
    expect(b.records[0].ratio).toBeCloseTo(1.5, 12);
    expect(b.records[1]).toMatchObject({ baseline: { from: 'none' }, ratio: null, benefit: null });
  });
});

describe('the benefit mark is compared exactly', () => {
  it('12 words in 10 s against 10 words in 10 s is 1.2 and meets the mark (common practice)', () => {
    const r = run([HEAD, '2026-03-02,C-0417,,,unassisted,10,10,,', '2026-03-02,C-0417,s.rungs,Short,paced,12,10,,']);
    expect(r.records[1].benefit).toBe(true);
  });

  it('meets the mark where floating-point division falls just below 1.2', () => {
    // computed: (6 / 20.5) / (1 / 4.1) = 24.6 / 20.5 = 1.2 exactly; in doubles it is 1.1999999999999997.
    expect(6 / 20.5 / (1 / 4.1)).toBeLessThan(1.2);
    const r = run([HEAD, '2026-03-02,C-0417,,,unassisted,1,4.1,,', '2026-03-02,C-0417,s.rungs,Short,paced,6,20.5,,']);
    expect(r.records[1].benefit).toBe(true);
  });

  it('just below the mark does not meet it, and the mark is a setting', () => {
    // computed: 23 / 20 = 1.15 w/s against 1.0 = 1.15 < 1.2; with the mark at 1.15 it meets it.
    const lines = [HEAD, '2026-03-02,C-0417,,,unassisted,10,10,,', '2026-03-02,C-0417,s.rungs,Short,paced,23,20,,'];
    expect(run(lines).records[1].benefit).toBe(false);
    const o = applySettings(defaultOptions(), parseScript('@benefit-mark 1.15\n').header, 'config');
    expect(renderFindings(o.findings)).toEqual([]);
    expect(run(lines, { options: o.options.records }).records[1].benefit).toBe(true);
  });
});

describe('bad rows: each kind is reported on its cell, and the rest is used', () => {
  const r = run([
    HEAD, // line 1
    '2026-03-02,C-0417,,,unassisted,10,10,,', // 2: good
    '2026-03-02,C-0417,s.rungs,Short,paced,12,0,,', // 3: zero seconds (column 42, computed)
    '2026-03-02,C-0417,s.rungs,Short,paced,12,-4,,', // 4: negative seconds (42)
    '2026-03-02,C-0417,s.rungs,Short,paced,-3,10,,', // 5: negative words (39)
    '2026-03-02,C-0417,s.rungs,Short,paced,2.5,10,,', // 6: fractional words (39)
    '2026-03-02,C-0417,s.rungs,Short,paced,120,10,,', // 7: 12 w/s, implausible (39)
    '2026-02-30,C-0417,s.rungs,Short,paced,12,10,,', // 8: impossible date (1)
    '2027-01-04,C-0417,s.rungs,Short,paced,12,10,,', // 9: future date (1)
    '02/03/2026,C-0417,s.rungs,Short,paced,12,10,,', // 10: not ISO 8601 (1)
    '2026-03-02,C-0417,s.rungs,Short,echo,12,10,,', // 11: unknown condition (33)
    '2026-03-02,C-0417,gone.rungs,Short,paced,12,10,,', // 12: no such script (19)
    '2026-03-02,C-0417,s.rungs,Middle,paced,12,10,,', // 13: no such rung (27)
    '2026-03-02,C-0417,s.rungs,Short,paced,12,10,fast,', // 14: unreadable pace (45)
    '2026-03-02,C-0417,,,paced,12,10,,', // 15: paced without script, rung or pace (19, 20, 33)
    '2026-03-02,C-0417,,,unassisted,10,10,,', // 16: repeats line 2 (1)
    '2026-03-02,C-0417,s.rungs,Short,paced,12,10,,14', // 17: more correct than words (46)
    '2026-03-09,C-0417,s.rungs,Short,paced,13,10,,', // 18: good
  ]);

  it('names file line and column of each bad cell (columns computed by counting characters)', () => {
    expect(where(r)).toEqual([
      '3:42 bad-record', '4:42 bad-record', '5:39 bad-record', '6:39 bad-record', '7:39 bad-record',
      '8:1 bad-record', '9:1 bad-record', '10:1 bad-record', '11:33 bad-record', '12:19 bad-record',
      '13:27 bad-record', '14:45 bad-record', '15:19 bad-record', '15:20 bad-record', '15:33 bad-record',
      '16:1 duplicate-record', '17:46 bad-record',
    ]);
    expect(r.problems.every((p) => p.severity === 'error')).toBe(true);
  });

  it('says what is wrong in words', () => {
    const msg = (line: number) => r.problems.filter((p) => p.line === line - 1).map((p) => p.message);
    expect(msg(3)[0]).toBe('seconds must be above 0, not 0');
    expect(msg(6)[0]).toBe('words must be a whole number, 0 or more, not 2.5');
    expect(msg(7)[0]).toMatch(/^120 words in 10 s is 12\.0 words\/s, faster than any plausible speech \(8 words\/s\)/);
    expect(msg(8)[0]).toBe('2026-02-30 is not a date of the calendar');
    expect(msg(9)[0]).toBe('2027-01-04 is in the future (today is 2026-12-02)');
    expect(msg(11)[0]).toBe('unknown condition "echo": write unassisted or paced');
    expect(msg(13)[0]).toBe('"s.rungs" has no rung "Middle" (its rungs: 1 "Short", 2 "Long")');
    expect(msg(16)[0]).toBe('this row repeats line 2; it is counted once');
    expect(msg(10)[0]).toBe('"02/03/2026" is not an ISO 8601 date: write YYYY-MM-DD, e.g. 2026-03-02');
    expect(msg(12)[0]).toBe('no script "gone.rungs" (the path is relative to this records file)');
    expect(msg(15)).toEqual([
      'script is empty: a paced row names the script it practised',
      'rung is empty: a paced row names the rung it practised (name or number)',
      'no pace: give one in the pace column, or a script and rung that set one',
    ]);
    expect(msg(17)[0]).toBe('14 correct words is more than the 12 words of the row');
  });

  it('still computes the good rows', () => {
    expect(r.records.map((x) => x.line + 1)).toEqual([2, 18]);
    // computed: 13 / 10 = 1.3 w/s against 03-02's 1.0 w/s.
    expect(r.records[1].ratio).toBeCloseTo(1.3, 12);
    expect(r.rows).toBe(17);
  });

  it('reports a missing required column on the header and an unknown one as a warning', () => {
    const m = run(['date,client,script,rung,condition,words,colour', '2026-03-02,C-0417,,,unassisted,10,red']);
    expect(m.problems.map((p) => [p.line, p.character, p.severity, p.message])).toEqual([
      [0, 0, 'error', 'the header has no "seconds" column'],
      [0, 40, 'warning', 'unknown column "colour": it is kept in the file but not read (columns: date, client, script, rung, condition, words, seconds, pace, task, transcript, correct, note)'],
    ]);
  });

  it('reports a row the CSV parser cannot read, and reads the others', () => {
    const q = run([HEAD, '2026-03-02,C-0417,,,unassisted,10,10,,', '2026-03-02,C-0417,s.rungs,Short,paced,12,10,,"unclosed']);
    expect(q.records).toHaveLength(1);
    expect(q.problems.map((p) => [p.line, p.rule])).toEqual([[2, 'records-syntax']]);
  });
});

describe('file variants read the same: delimiters, quotes, BOM, CRLF', () => {
  const rows = [
    ['date', 'client', 'script', 'rung', 'condition', 'words', 'seconds', 'note'],
    ['2026-03-02', 'C-0417', '', '', 'unassisted', '10', '10', 'picture description'],
    ['2026-03-02', 'C-0417', 's.rungs', 'Short', 'paced', '12', '10', 'said "fine", then paused'],
  ];
  const quote = (c: string) => (/[",;\t]/.test(c) ? `"${c.replace(/"/g, '""')}"` : c);
  const as = (d: string, eol = '\n', bom = '') => bom + rows.map((r) => r.map(quote).join(d)).join(eol) + eol;
  const base = readProgress({ text: as(','), scripts: lookup, today: TODAY });

  it.each([
    ['semicolon', as(';'), ';'],
    ['tab', as('\t'), '\t'],
    ['comma with BOM and CRLF', as(',', '\r\n', '\uFEFF'), ','],
    ['semicolon with CRLF', as(';', '\r\n'), ';'],
  ])('%s', (_name, text, delimiter) => {
    const r = readProgress({ text, scripts: lookup, today: TODAY });
    expect(r.delimiter).toBe(delimiter);
    expect(r.problems).toEqual([]);
    expect(r.records).toEqual(base.records);
    expect(r.records[1].note).toBe('said "fine", then paused');
  });

  it('keeps line numbers after a quoted cell that spans lines', () => {
    const text = `${HEAD},note\n2026-03-02,C-0417,,,unassisted,10,10,,,"two\nlines"\n2026-03-02,C-0417,s.rungs,Short,paced,0.5,10,,,\n`.replace(`${HEAD},note`, 'date,client,script,rung,condition,words,seconds,pace,correct,note');
    const r = readProgress({ text, scripts: lookup, today: TODAY });
    expect(r.records[0].note).toBe('two\nlines');
    // The bad words cell is on line 4 (0-based 3), column 39 (computed).
    expect(r.problems.map((p) => [p.line, p.character])).toEqual([[3, 38]]);
  });
});

describe('transcripts are counted with the project tokeniser, fillers left out', () => {
  const T = 'date,client,script,rung,condition,words,seconds,transcript';
  it('counts words the tokeniser yields and leaves out the default fillers', () => {
    const said = 'Um, I want uh the coffee at 3:30, er, please';
    const r = readProgress({ text: `${T}\n2026-03-02,C-0417,,,unassisted,,10,"${said}"\n`, scripts: lookup, today: TODAY, data: words });
    const spoken = tokenize(said).flatMap((t) => t.words);
    // The tokeniser says "3:30" as "three thirty" (two words); computed by hand: 11 spoken words,
    // 3 of them fillers (um, uh, er), so 8 words.
    expect(spoken).toHaveLength(11);
    expect(r.records[0]).toMatchObject({ words: 8, wordsFromTranscript: true, fillersLeftOut: ['um', 'uh', 'er'] });
    // CMU syllables: i 1, want 1, the 1, coffee 2, at 1, three 1, thirty 2, please 1 = 10 (computed).
    expect(r.records[0].sps).toBeCloseTo(1, 12);
  });

  it('takes the filler list from the settings', () => {
    const o = applySettings(defaultOptions(), parseScript('@fillers um\n').header, 'config').options.records;
    const r = readProgress({ text: `${T}\n2026-03-02,C-0417,,,unassisted,,10,"um uh hello"\n`, scripts: lookup, today: TODAY, options: o });
    expect(r.records[0]).toMatchObject({ words: 2, fillersLeftOut: ['um'] });
  });
});

describe('trends', () => {
  const paced = (date: string, w: number) => `${date},C-0417,s.rungs,Short,paced,${w},10,,`;
  const base = '2026-03-02,C-0417,,,unassisted,10,10,,';

  it('slope per week agrees with jstat (r × sd_y / sd_x) on uneven days', () => {
    // Sessions on days 0, 3 and 14 with ratios 1.0, 1.1, 1.5 (computed slope 0.2512 per week).
    const r = run([HEAD, base, paced('2026-03-02', 10), paced('2026-03-05', 11), paced('2026-03-16', 15)]);
    const t = r.trends[0];
    const x = [0, 3 / 7, 2];
    const y = [1.0, 1.1, 1.5];
    const slope = jStat.corrcoeff(x, y) * (jStat.stdev(y, true) / jStat.stdev(x, true));
    expect(t.slopePerWeek).toBeCloseTo(slope, 10);
    expect(t.slopePerWeek).toBeCloseTo(0.2512, 4);
    expect(t.atMark).toBe(1);
    expect(t.ready).toBe(false);
    expect(t.note).toBe('at or above the mark (1.2) in 1 of 3 sessions');
  });

  it('pools a day\'s paced rows into one session, and needs N sessions before a readiness note', () => {
    // computed: (12 + 14) / (10 + 10) = 1.3 w/s on the one day.
    const r = run([HEAD, base, paced('2026-03-02', 12), paced('2026-03-02', 14)]);
    expect(r.trends[0].sessions).toHaveLength(1);
    expect(r.trends[0].ratios[0]).toBeCloseTo(1.3, 12);
    expect(r.trends[0].slopePerWeek).toBeNull();
    expect(r.trends[0].note).toBe('at or above the mark (1.2) in 1 of 1 session; 2 are needed before a readiness note');
  });

  it('holds readiness back while accuracy is under the floor', () => {
    const o = applySettings(defaultOptions(), parseScript('@accuracy-floor 90%\n@ready-sessions 2\n').header, 'config').options.records;
    const lines = [HEAD, base, `${paced('2026-03-02', 13)}12`, `${paced('2026-03-09', 13)}11`];
    // computed: accuracy 12/13 = 92% then 11/13 = 85% < 90%.
    const t = run(lines, { options: o }).trends[0];
    expect(t.ready).toBe(false);
    expect(t.note).toBe('meets the mark in the last 2 sessions, but accuracy is below 90% or not recorded');
    expect(t.accuracySlopePerWeek).toBeCloseTo(11 / 13 - 12 / 13, 12);
  });

  it('rejects unreadable settings with a message', () => {
    const p = applySettings(defaultOptions(), parseScript('@benefit-mark lots\n@accuracy-floor 120%\n').header, 'config').findings;
    expect(renderFindings(p).map((x) => x.message)).toEqual([
      '@benefit-mark must be a number above 0, e.g. 1.2, not "lots"',
      '@accuracy-floor is a fraction 0-1 or a percentage, e.g. 0.8 or 80%, not "120%"',
    ]);
  });
});

describe('bad input never throws (fast-check, seeded)', () => {
  // Cells drawn from values that look like records and values that do not, joined by any of the
  // delimiters, with quotes, blank lines and CR line ends mixed in.
  const cell = fc.oneof(
    fc.constantFrom('', '2026-03-02', '2026-02-30', 'C-0417', 's.rungs', 'Short', '2', 'paced', 'unassisted', '12', '0', '-1', '1.5', '"', '""', '"a,b"', 'um uh'),
    fc.string({ maxLength: 8 }),
  );
  const line = fc.tuple(fc.array(cell, { maxLength: 9 }), fc.constantFrom(',', ';', '\t')).map(([cells, d]) => cells.join(d));
  const text = fc.tuple(fc.array(line, { maxLength: 8 }), fc.constantFrom('\n', '\r\n', '\r')).map(([lines, eol]) => [HEAD, ...lines].join(eol));

  it('keeps every problem inside the text and never uses a row it reports', () => {
    fc.assert(
      fc.property(text, (t) => {
        const r = readProgress({ text: t, scripts: lookup, today: TODAY, data: words });
        const lineCount = t.split(/\r\n|\r|\n/).length;
        for (const p of r.problems) expect(p.line).toBeLessThan(lineCount);
        const reported = new Set(r.problems.map((p) => p.line));
        expect(r.records.every((x) => !reported.has(x.line))).toBe(true);
      }),
      { seed: 20260302, numRuns: 300 },
    );
  });
});
