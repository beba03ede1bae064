// Paces and projected durations. Paced practice sets the model's rate in words per second (the
// trade's unit); syllables per second is accepted when a script says so. Durations leave out
// pauses and phrase-final lengthening, so real items run somewhat longer.
import type { Pace, PaceTiming, PaceUnit } from './types';
import { pushAll } from './arrays';
import { excerpt } from './excerpt';

/** Adult reading-aloud rate: 183 words per minute = 3.05 words/s (Brysbaert 2019, JML 109). */
export const READING_NORM_WPS = 183 / 60;

/** Fastest pace accepted, per second (words or syllables): no speech model runs faster. */
export const MAX_PACE = 20;

/** English read text runs near 6.2 syllables/s (Pellegrino, Coupé & Marsico 2011, Language 87(3); from memory). */
export const READING_NORM_SPS = 6.2;

// The pace facts, defined once for the rules, the score table and the timings. Rates a hair
// above a limit by floating-point rounding (183/60 vs a written 3.05) do not count as above it.
const EPS = 1e-9;

/** Whether a word rate is faster than adults read aloud (`normWps`, default Brysbaert's 3.05). */
export function fasterThanReadingWords(wordsPerSecond: number, normWps: number = READING_NORM_WPS): boolean {
  return wordsPerSecond > normWps + EPS;
}

/** Whether a syllable rate is faster than read English (READING_NORM_SPS). */
export function fasterThanReadingSyllables(syllablesPerSecond: number): boolean {
  return syllablesPerSecond > READING_NORM_SPS + EPS;
}

/** A word rate over the client's unassisted rate (1.2 = 20 % faster); null without a baseline. */
export function baselineRatio(wordsPerSecond: number, baselineWps: number | null): number | null {
  return baselineWps && baselineWps > 0 ? wordsPerSecond / baselineWps : null;
}

/** Whether a word rate is slower than the client's unassisted rate. */
export function belowBaseline(wordsPerSecond: number, baselineWps: number | null): boolean {
  return Boolean(baselineWps && baselineWps > 0) && wordsPerSecond < baselineWps! - EPS;
}

const UNIT_WORDS: Record<string, PaceUnit> = {
  wps: 'wps',
  'w/s': 'wps',
  'words/s': 'wps',
  'word/s': 'wps',
  sps: 'sps',
  's/s': 'sps',
  'syl/s': 'sps',
  'syllables/s': 'sps',
  'syllable/s': 'sps',
};

export function formatNumber(n: number, digits = 2): string {
  return String(Number(n.toFixed(digits)));
}

export function makePace(value: number, unit: PaceUnit): Pace {
  return { value, unit, label: `${formatNumber(value, 3)} ${unit}` };
}

/**
 * Reads a pace list such as "1, 1.5, 2 wps" or "1.5 wps, 4 sps". A unit applies to the numbers
 * written before it since the previous unit; numbers with no unit after them are words/s.
 */
export function parsePaces(text: string): { paces: Pace[]; error: string | null } {
  const parts = text.toLowerCase().replace(/,/g, ' ').split(/\s+/).filter(Boolean);
  const paces: Pace[] = [];
  let pending: number[] = [];
  for (const part of parts) {
    const m = /^(\d+(?:\.\d+)?|\.\d+)([a-z/]*)$/.exec(part);
    if (m) {
      const value = Number(m[1]);
      if (!(value > 0)) return { paces: [], error: `pace "${excerpt(part)}" must be above 0` };
      if (value > MAX_PACE) return { paces: [], error: `pace ${excerpt(part)} is not a plausible speech rate (above 20 per second)` };
      if (m[2]) {
        const unit = UNIT_WORDS[m[2]];
        if (m[2] === 'wpm' || m[2] === 'spm') {
          return { paces: [], error: `paces are per second, not per minute: divide by 60 (90 ${m[2]} = 1.5 ${m[2] === 'wpm' ? 'wps' : 'sps'})` };
        }
        if (!unit) return { paces: [], error: `unknown unit "${excerpt(m[2])}": use wps (words/s) or sps (syllables/s)` };
        pushAll(paces, pending.map((v) => makePace(v, unit)));
        paces.push(makePace(value, unit));
        pending = [];
      } else pending.push(value);
      continue;
    }
    const unit = UNIT_WORDS[part];
    if (part === 'wpm' || part === 'spm') {
      return { paces: [], error: `paces are per second, not per minute: divide by 60 (90 ${part} = 1.5 ${part === 'wpm' ? 'wps' : 'sps'})` };
    }
    if (!unit) return { paces: [], error: `cannot read "${excerpt(part)}" as a pace: write numbers with wps or sps, e.g. "1.5, 2 wps"` };
    if (!pending.length) return { paces: [], error: `unit "${excerpt(part)}" has no number before it` };
    pushAll(paces, pending.map((v) => makePace(v, unit)));
    pending = [];
  }
  pushAll(paces, pending.map((v) => makePace(v, 'wps')));
  if (!paces.length) return { paces: [], error: 'no pace given: write e.g. "1.5, 2 wps"' };
  return { paces, error: null };
}

/**
 * Projected time of an item at a pace: words / words-per-second, or syllables / syllables-per-second.
 * An item with no words takes 0 s. Rates are in the unit the other pace would imply.
 */
export function timeAt(
  pace: Pace,
  words: number,
  syllables: number,
  baselineWps: number | null,
  readingNormWps: number = READING_NORM_WPS,
): PaceTiming {
  const seconds = pace.unit === 'wps' ? words / pace.value : syllables / pace.value;
  const wordRate = seconds > 0 ? words / seconds : pace.unit === 'wps' ? pace.value : 0;
  const syllableRate = seconds > 0 ? syllables / seconds : pace.unit === 'sps' ? pace.value : 0;
  return {
    pace,
    seconds,
    syllableRate,
    wordRate,
    baselineRatio: baselineRatio(wordRate, baselineWps),
    aboveReadingNorm: fasterThanReadingWords(wordRate, readingNormWps),
  };
}
