// The timing plan: item length, word slots, phrase pauses, gaps, echo windows, session lengths and
// the timing settings.
import { describe, expect, it } from 'vitest';
import { defaultOptions } from '../../server/src/core/options';
import { makePace } from '../../server/src/core/pace';
import { describeRungLength, formatLength, planSession, sessionLengths } from '../../server/src/core/timing';
import { readFileSync } from 'node:fs';
import { analyzeSegments } from '../../server/src/core/segments';
import { analyzeText, words } from '../helpers/data';
import { renderFindings } from '../../server/src/rules/index';

describe('word slots inside an item', () => {
  // "My granddaughter visits every Sunday afternoon." is 6 words and 14 syllables
  // (1+3+2+3+2+3 in cmu-pronouncing-dictionary@3.0.0; computed): 2.40 s at 2.5 words/s.
  const text = '@paces 2.5 wps, 4 sps\nMy granddaughter visits every Sunday afternoon.\n';

  it('syllable-proportional slots (computed: 2.4 s x syllables / 14)', () => {
    const plan = planSession(analyzeText(text));
    const w = plan.items[0].words;
    expect(w.map((x) => x.syllables)).toEqual([1, 3, 2, 3, 2, 3]);
    const before = [0, 1, 4, 6, 9, 11];
    w.forEach((x, i) => expect(x.onset).toBeCloseTo((2.4 * before[i]) / 14, 9));
    expect(w[5].offset).toBeCloseTo(2.4, 9);
    expect(plan.seconds).toBeCloseTo(2.4, 9);
  });

  it('a syllable pace lasts syllables / pace (computed: 14 / 4 = 3.5 s)', () => {
    const plan = planSession(analyzeText(text), { pace: makePace(4, 'sps') });
    expect(plan.items[0].end).toBeCloseTo(3.5, 9);
    // At a syllable pace each syllable gets 1/4 s: "granddaughter" (3) starts at 0.25 s, lasts 0.75 s.
    expect(plan.items[0].words[1].onset).toBeCloseTo(0.25, 9);
    expect(plan.items[0].words[1].offset).toBeCloseTo(1, 9);
  });

  it('equal slots give every spoken word 1 / pace (computed: 0.4 s at 2.5 wps)', () => {
    const plan = planSession(analyzeText(`@word-slots equal\n${text}`));
    plan.items[0].words.forEach((x, i) => {
      expect(x.onset).toBeCloseTo(0.4 * i, 9);
      expect(x.offset - x.onset).toBeCloseTo(0.4, 9);
    });
  });

  it('a number written as one token keeps one slot for its spoken words (computed)', () => {
    // "21" is spoken "twenty one": 2 words of 3 syllables; at 1 wps with equal slots the item
    // "Buy 21 eggs." lasts 4 s and "21" holds 2 s.
    const plan = planSession(analyzeText('@paces 1\n@word-slots equal\nBuy 21 eggs.\n'));
    const w = plan.items[0].words;
    expect(w.map((x) => x.text)).toEqual(['Buy', '21', 'eggs']);
    expect(w[1].words).toBe(2);
    expect(w[1].offset - w[1].onset).toBeCloseTo(2, 9);
    expect(plan.items[0].end).toBeCloseTo(4, 9);
  });

  it('a phrase-break pause follows a comma but not an abbreviation or the last word (computed)', () => {
    const a = analyzeText('@paces 1\n@word-slots equal\n@phrase-pause 500 ms\nAsk Mr. Lee, please.\n');
    const w = planSession(a).items[0].words;
    expect(w.map((x) => x.phraseBreak)).toEqual([false, false, true, false]);
    // 4 words at 1 wps = 4 s of speech plus one 0.5 s pause after "Lee,".
    expect(w.map((x) => x.onset)).toEqual([0, 1, 2, 3.5]);
    expect(planSession(a).items[0].end).toBeCloseTo(4.5, 9);
  });
});

describe('sessions', () => {
  const two = '@paces 1\n== A\nHi there.\nThank you.\n== B\nSee you soon.\n';

  it('gaps separate items and rungs (default 2 s; computed)', () => {
    const plan = planSession(analyzeText(two));
    expect(plan.items.map((i) => [i.start, i.end])).toEqual([[0, 2], [4, 6], [8, 11]]);
    expect(plan.seconds).toBe(11);
    expect(plan.rungs.map((r) => [r.start, r.end])).toEqual([[0, 6], [8, 11]]);
  });

  it('echo mode adds a response window of the model length times @echo-window (computed)', () => {
    const plan = planSession(analyzeText(`@echo-window 1.5\n@item-gap 1 s\n${two}`), { mode: 'echo' });
    // Hi there: 0-2, response 2-5; gap 1; Thank you 6-8, response 8-11; gap 1; See you soon 12-15, response 15-19.5.
    expect(plan.items.map((i) => [i.start, i.end, i.response?.start, i.response?.end])).toEqual([
      [0, 2, 2, 5],
      [6, 8, 8, 11],
      [12, 15, 15, 19.5],
    ]);
    expect(plan.seconds).toBe(19.5);
  });

  it('one rung starts at 0 and a pace can be forced', () => {
    const plan = planSession(analyzeText(two), { rung: 1, pace: makePace(1.5, 'wps') });
    expect(plan.items).toHaveLength(1);
    expect(plan.items[0].start).toBe(0);
    expect(plan.items[0].end).toBeCloseTo(2, 9);
  });

  it('session lengths per rung and pace, and for the script (computed)', () => {
    const lengths = sessionLengths(analyzeText(`@paces 1, 2 wps\n${two.replace('@paces 1\n', '')}`));
    // Rung A: 2 + 2 + 2 s at 1 wps = 6 s; at 2 wps 1 + 2 + 1 = 4 s. Script at 1 wps: 6 + 2 + 3 = 11 s.
    expect(lengths.rungs[0].paces.map((p) => p.seconds)).toEqual([6, 4]);
    expect(lengths.script.map((p) => [p.pace.label, p.seconds])).toEqual([['1 wps', 11], ['2 wps', 7.5]]);
    expect(describeRungLength(lengths.rungs[0], 0)).toBe('rung 1 at 1 wps: 6 s with gaps');
  });

  it('formats lengths for people (computed)', () => {
    expect(formatLength(220)).toBe('3 min 40 s');
    expect(formatLength(120)).toBe('2 min');
    expect(formatLength(42.4)).toBe('42 s');
    expect(formatLength(2.25)).toBe('2.3 s');
  });

  it('an empty script plans nothing', () => {
    expect(planSession(analyzeText('// nothing yet\n')).seconds).toBe(0);
  });
});

describe('timing settings', () => {
  it('defaults: syllable slots, no phrase pause, 2 s gap, echo window 1', () => {
    expect(defaultOptions().timing).toEqual({ slots: 'syllables', phrasePause: 0, gap: 2, echoWindow: 1 });
  });

  it('reads the header keys', () => {
    const a = analyzeText('@word-slots equal\n@phrase-pause 0.25 s\n@item-gap 3\n@echo-window 2x\nHi.\n');
    expect(a.options.timing).toEqual({ slots: 'equal', phrasePause: 0.25, gap: 3, echoWindow: 2 });
  });

  it('reports unreadable values at the value, keeping the default', () => {
    const a = analyzeText('@item-gap soon\n@word-slots by-ear\nHi.\n');
    const p = renderFindings(a.findings).filter((x) => x.rule === 'bad-value');
    expect(p.map((x) => [x.line, x.character])).toEqual([[0, 10], [1, 12]]);
    expect(p[0].message).toMatch(/@item-gap takes a time in seconds/);
    expect(a.options.timing.gap).toBe(2);
  });
});

describe('session lengths kept per rung and per item', () => {
  // The code lens and hovers read rung lengths from sessionLengths, which sums each item's kept
  // length instead of planning the rung; planSession is the definition, and the two must agree
  // to the last bit, in both modes, with phrase pauses and non-default timing, before and after
  // an edit that re-analyses one rung (its other items keep their words and their kept lengths).
  const scripts = ['family-visits-draft.rungs', 'kitchen-sets.rungs', 'morning-routine.rungs'].map((f) =>
    readFileSync(new URL(`../../sample-scripts/${f}`, import.meta.url), 'utf8'),
  );
  const extra = '@paces 1.5 wps, 3 sps\n@item-gap 0.7 s\n@phrase-pause 0.3 s\n@echo-window 1.5\n@word-slots equal\n== One\nWell, yes: come in, sit down.\nHi.\nGood morning, Dr. Okafor.\n== Two\nRead it (twice), then stop.\n';

  it('equal planSession for every rung, pace and mode, before and after an edit', () => {
    // The settings of the last script are all read (no problems), so the timing is not the default.
    expect(renderFindings(analyzeText(extra).findings).filter((p) => p.severity !== 'info')).toEqual([]);
    expect(analyzeText(extra).options.timing).toMatchObject({ gap: 0.7, phrasePause: 0.3, slots: 'equal' });
    for (const text of [...scripts, extra]) {
      const state = analyzeSegments({ text, data: words }, undefined);
      const edited = text.replace(/\n([A-Z][^\n|]*)/, '\n$1 again');
      const after = analyzeSegments({ text: edited, data: words }, state);
      for (const a of [state.output, after.output]) {
        for (const mode of ['unison', 'echo'] as const) {
          const lengths = sessionLengths(a, mode);
          for (const r of a.rungs) {
            const planned = r.paces.map((pace) => (r.items.length ? planSession(a, { rung: r.index, pace, mode }).seconds : 0));
            expect(lengths.rungs[r.index].paces.map((p) => p.seconds)).toEqual(planned);
          }
        }
      }
    }
  });
});
