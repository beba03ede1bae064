// The pure audio parts: the energy detector on synthetic tone bursts, the time-stretch, and the
// comparison with a plan. Expected values are computed from the signals the tests build.
import { describe, expect, it } from 'vitest';
import { detectSegments, measureAgainstPlan } from '../../server/src/core/audio/onsets';
import { renderItems, slotTail, trimSilence } from '../../server/src/core/audio/modelSpeech';
import { stretchTo } from '../../server/src/core/audio/stretch';
import { planSession } from '../../server/src/core/timing';
import { analyzeText } from '../helpers/data';

const SR = 22050;

/** A 200 Hz tone at amplitude 0.5 during each [start, end) second range, silence elsewhere. */
function bursts(ranges: [number, number][], seconds: number): Float32Array {
  const x = new Float32Array(Math.round(seconds * SR));
  for (const [a, b] of ranges) for (let i = Math.round(a * SR); i < Math.round(b * SR); i++) x[i] = 0.5 * Math.sin((2 * Math.PI * 200 * i) / SR);
  return x;
}

/** Upward zero crossings per second: the frequency of a pure tone. */
function frequency(x: Float32Array): number {
  let n = 0;
  for (let i = 1; i < x.length; i++) if (x[i - 1] < 0 && x[i] >= 0) n++;
  return n / (x.length / SR);
}

describe('energy detector', () => {
  it('finds tone bursts within one 5 ms hop (computed)', () => {
    const s = detectSegments(bursts([[0.2, 0.5], [0.8, 1.1], [1.5, 1.6]], 2), SR);
    expect(s).toHaveLength(3);
    [[0.2, 0.5], [0.8, 1.1], [1.5, 1.6]].forEach(([a, b], k) => {
      expect(Math.abs(s[k].onset - a)).toBeLessThanOrEqual(0.01);
      expect(Math.abs(s[k].offset - b)).toBeLessThanOrEqual(0.01);
    });
  });

  it('joins bursts split by less than the shortest silence, and finds nothing in silence', () => {
    expect(detectSegments(bursts([[0.1, 0.3], [0.31, 0.5]], 1), SR)).toHaveLength(1);
    expect(detectSegments(new Float32Array(SR), SR)).toEqual([]);
  });

  it('trims leading and trailing silence', () => {
    const t = trimSilence(bursts([[0.25, 0.75]], 1), SR);
    // Within one 10 ms frame plus one 5 ms hop (computed from the frame layout).
    expect(Math.abs(t.length / SR - 0.5)).toBeLessThanOrEqual(0.015);
  });
});

describe('time-stretch (WSOLA)', () => {
  it('gives exactly the length asked for and keeps the pitch (computed: 200 Hz tone)', () => {
    const tone = bursts([[0, 0.5]], 0.5);
    for (const factor of [0.5, 0.8, 1.5, 2.5]) {
      const out = stretchTo(tone, Math.round(0.5 * factor * SR), SR);
      expect(out.length).toBe(Math.round(0.5 * factor * SR));
      expect(Math.abs(frequency(out) - 200)).toBeLessThan(6);
    }
    expect(stretchTo(new Float32Array(0), 100, SR)).toEqual(new Float32Array(100));
  });
});

describe('model speech laid on the plan, then measured', () => {
  it('bursts rendered into their slots measure at the planned pace and onsets', () => {
    const plan = planSession(analyzeText('@paces 1.5\n== R\nPass the bread, please.\nI want some tea.\n'));
    const clip = bursts([[0, 0.3]], 0.3);
    const audio = renderItems(plan.items, () => clip, SR, 0, plan.seconds + 0.5);
    const m = measureAgainstPlan(plan, detectSegments(audio, SR));
    expect(m.matched).toBe(m.words);
    expect(m.meanOnsetError).toBeLessThan(0.01);
    // Every slot but the item's last ends in a short silence; the last fills its slot, so the
    // measured span of an item is its planned length and the pace comes out as planned.
    expect(Math.abs(m.achievedWps / 1.5 - 1)).toBeLessThan(0.01);
    expect(m.targetWps).toBeCloseTo(1.5, 9);
    expect(slotTail(0.5)).toBeCloseTo(0.075, 9);
  });

  it('audio that runs late is measured as late', () => {
    const plan = planSession(analyzeText('@paces 1\nI want some tea.\n'));
    const late = plan.items.map((it) => ({ ...it, words: it.words.map((w) => ({ ...w, onset: w.onset + 0.1, offset: w.offset + 0.1 })) }));
    const audio = renderItems(late, () => bursts([[0, 0.3]], 0.3), SR, 0, 5);
    const m = measureAgainstPlan(plan, detectSegments(audio, SR));
    expect(m.meanOnsetError).toBeGreaterThan(0.09);
    expect(m.meanOnsetError).toBeLessThan(0.11);
  });
});
