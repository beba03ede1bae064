// An energy-based detector of sound segments (word onsets and ends) in mono audio, and the
// comparison of what was detected with the timing plan. Short-time energy over 10 ms frames every
// 5 ms; a frame is sound when it is within `thresholdDb` of the loudest frame; runs of sound
// separated by less than `minSilence` are joined and runs shorter than `minSound` dropped. This is
// the classic endpoint detector of Rabiner & Sambur 1975 (Bell System Technical Journal 54(2))
// without the zero-crossing refinement (from memory).
import type { SessionPlan } from '../timing';

export interface Segment {
  /** Start and end of a run of sound, in seconds from the start of the audio. */
  onset: number;
  offset: number;
}

export interface DetectorOptions {
  /** Frames within this many dB of the loudest frame count as sound (default -35). */
  thresholdDb: number;
  /** Shortest silence that separates two segments, in seconds (default 0.03). */
  minSilence: number;
  /** Shortest segment kept, in seconds (default 0.03). */
  minSound: number;
}

export const DEFAULT_DETECTOR: DetectorOptions = { thresholdDb: -35, minSilence: 0.03, minSound: 0.03 };

const FRAME = 0.01;
const HOP = 0.005;

/** Segments of sound in `samples` (floats in -1..1). Silence gives none. */
export function detectSegments(samples: Float32Array, sampleRate: number, options: Partial<DetectorOptions> = {}): Segment[] {
  const o = { ...DEFAULT_DETECTOR, ...options };
  const frame = Math.max(1, Math.round(FRAME * sampleRate));
  const hop = Math.max(1, Math.round(HOP * sampleRate));
  const db: number[] = [];
  for (let start = 0; start + frame <= samples.length; start += hop) {
    let sum = 0;
    for (let i = start; i < start + frame; i++) sum += samples[i] * samples[i];
    db.push(10 * Math.log10(sum / frame + 1e-12));
  }
  if (!db.length) return [];
  const peak = Math.max(...db);
  // An absolute floor keeps near-silent files from having their noise read as speech.
  const threshold = Math.max(peak + o.thresholdDb, -70);
  const runs: Segment[] = [];
  let runStart = -1;
  db.forEach((d, k) => {
    if (d > threshold && runStart < 0) runStart = k;
    if ((d <= threshold || k === db.length - 1) && runStart >= 0) {
      const end = d > threshold ? k : k - 1;
      runs.push({ onset: (runStart * hop) / sampleRate, offset: (end * hop + frame) / sampleRate });
      runStart = -1;
    }
  });
  const joined: Segment[] = [];
  for (const r of runs) {
    const last = joined[joined.length - 1];
    if (last && r.onset - last.offset < o.minSilence) last.offset = r.offset;
    else joined.push({ ...r });
  }
  return joined.filter((s) => s.offset - s.onset >= o.minSound);
}

export interface PlanMeasurement {
  /** Planned words, and how many had a detected onset within `window` seconds. */
  words: number;
  matched: number;
  /** Mean and largest absolute difference between planned and detected word onsets, in seconds. */
  meanOnsetError: number;
  maxOnsetError: number;
  /** Words per second measured (first detected onset to last detected end of each item, phrase pauses left out). */
  achievedWps: number;
  /** Words per second the plan asks for, measured the same way on the plan. */
  targetWps: number;
  /** The sums behind the rates (for combining measurements of several files). */
  spokenWords: number;
  measuredSeconds: number;
  plannedSeconds: number;
}

/** One measurement of several (word-weighted errors, rates over the summed spans). */
export function combineMeasurements(list: PlanMeasurement[]): PlanMeasurement {
  const sum = (f: (m: PlanMeasurement) => number) => list.reduce((s, m) => s + f(m), 0);
  const matched = sum((m) => m.matched);
  const spokenWords = sum((m) => m.spokenWords);
  const measuredSeconds = sum((m) => m.measuredSeconds);
  const plannedSeconds = sum((m) => m.plannedSeconds);
  return {
    words: sum((m) => m.words),
    matched,
    meanOnsetError: matched ? sum((m) => (m.matched ? m.meanOnsetError * m.matched : 0)) / matched : NaN,
    maxOnsetError: Math.max(0, ...list.map((m) => m.maxOnsetError)),
    achievedWps: measuredSeconds > 0 ? spokenWords / measuredSeconds : NaN,
    targetWps: plannedSeconds > 0 ? spokenWords / plannedSeconds : NaN,
    spokenWords,
    measuredSeconds,
    plannedSeconds,
  };
}

/**
 * Compares detected segments with the plan (both timed from the same zero). A planned word is
 * matched to the nearest detected onset within `window` seconds; each item's measured span runs
 * from its first word's detected onset to the end of the last segment that starts inside it.
 */
export function measureAgainstPlan(plan: SessionPlan, segments: Segment[], window = 0.25): PlanMeasurement {
  let words = 0;
  let matched = 0;
  let errorSum = 0;
  let maxError = 0;
  let spokenWords = 0;
  let measuredSpan = 0;
  let plannedSpan = 0;
  const nearest = (t: number): Segment | null => {
    let best: Segment | null = null;
    for (const s of segments) if (Math.abs(s.onset - t) <= window && (!best || Math.abs(s.onset - t) < Math.abs(best.onset - t))) best = s;
    return best;
  };
  for (const item of plan.items) {
    const pauses = item.end - item.start - item.words.reduce((sum, w) => sum + (w.offset - w.onset), 0);
    for (const w of item.words) {
      words += 1;
      const s = nearest(w.onset);
      if (!s) continue;
      matched += 1;
      const e = Math.abs(s.onset - w.onset);
      errorSum += e;
      maxError = Math.max(maxError, e);
    }
    const first = nearest(item.start);
    const inside = segments.filter((s) => s.onset >= item.start - window && s.onset < item.end);
    if (!first || !inside.length) continue;
    const n = item.words.reduce((sum, w) => sum + w.words, 0);
    spokenWords += n;
    measuredSpan += inside[inside.length - 1].offset - first.onset - pauses;
    plannedSpan += item.end - item.start - pauses;
  }
  return {
    words,
    matched,
    meanOnsetError: matched ? errorSum / matched : NaN,
    maxOnsetError: maxError,
    achievedWps: measuredSpan > 0 ? spokenWords / measuredSpan : NaN,
    targetWps: plannedSpan > 0 ? spokenWords / plannedSpan : NaN,
    spokenWords,
    measuredSeconds: measuredSpan,
    plannedSeconds: plannedSpan,
  };
}
