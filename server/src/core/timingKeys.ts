// Settings of the timing plan (core/timing.ts), kept as one small block of the settings table so
// they read like every other key: word slots, phrase-break pause, gap between items, echo window.
import type { SettingSpec } from './settings';
import { DEFAULT_TIMING } from './timing';

/** Ten minutes: the longest pause or gap readSeconds takes. */
const SECONDS_RANGE = { min: 0, max: 600 };

/** Reads "2", "2 s", "0.5s" or "500 ms" as seconds; an error message when it cannot. */
export function readSeconds(value: string, key: string): number | string {
  const m = /^\s*(\d+(?:\.\d+)?|\.\d+)\s*(s|sec|secs|seconds?|ms)?\s*$/i.exec(value);
  if (!m) return `@${key} takes a time in seconds, e.g. "@${key} 1.5 s" or "@${key} 300 ms", not "${value.trim()}"`;
  const n = Number(m[1]) / (m[2]?.toLowerCase() === 'ms' ? 1000 : 1);
  if (n > SECONDS_RANGE.max) return `@${key} ${value.trim()} is longer than 10 minutes: write seconds, e.g. "2 s"`;
  return n;
}

export const TIMING_KEYS: SettingSpec[] = [
  {
    key: 'word-slots',
    aliases: [],
    scope: 'script',
    type: 'choice',
    default: DEFAULT_TIMING.slots,
    summary: 'How an item\'s time is shared among its words in cue tracks, model audio and the practice page: by syllables (default) or equal slots.',
    example: 'syllables',
    values: ['syllables', 'equal'],
    editor: {
      name: 'timing.wordSlots',
      markdownDescription: "How an item's time is shared among its words in cue tracks, model audio and the practice page: in proportion to `syllables` (default) or in `equal` slots. A script's `@word-slots` line wins.",
    },
    apply(value, o) {
      const v = value.trim().toLowerCase();
      if (v !== 'syllables' && v !== 'equal') return `@word-slots is syllables or equal, not "${value.trim()}"`;
      o.timing = { ...o.timing, slots: v };
      return null;
    },
  },
  {
    key: 'phrase-pause',
    aliases: [],
    scope: 'script',
    type: 'number',
    default: DEFAULT_TIMING.phrasePause,
    range: SECONDS_RANGE,
    summary: 'Pause after phrase-break punctuation (, ; : . ! ? dashes) inside an item, in seconds (default 0).',
    example: '0.3 s',
    editor: {
      name: 'timing.phrasePause',
      markdownDescription: "Pause after phrase-break punctuation (, ; : . ! ? dashes) inside an item, in seconds (default 0). A script's `@phrase-pause` line wins.",
    },
    apply(value, o) {
      const n = readSeconds(value, 'phrase-pause');
      if (typeof n === 'string') return n;
      o.timing = { ...o.timing, phrasePause: n };
      return null;
    },
  },
  {
    key: 'item-gap',
    aliases: ['gap'],
    scope: 'script',
    type: 'number',
    default: DEFAULT_TIMING.gap,
    range: SECONDS_RANGE,
    summary: 'Silence between items in a session plan, in seconds (default 2).',
    example: '2 s',
    editor: {
      name: 'timing.itemGap',
      markdownDescription: "Silence between items in a session plan (cue tracks, model audio, practice page, session length), in seconds (default 2). A script's `@item-gap` line wins.",
    },
    apply(value, o) {
      const n = readSeconds(value, 'item-gap');
      if (typeof n === 'string') return n;
      o.timing = { ...o.timing, gap: n };
      return null;
    },
  },
  {
    key: 'echo-window',
    aliases: [],
    scope: 'script',
    type: 'number',
    default: DEFAULT_TIMING.echoWindow,
    range: { min: 0, max: 10, above: true },
    summary: "Echo mode: the client's response window after each model, as a multiple of the model's length (default 1).",
    example: '1',
    editor: {
      name: 'timing.echoWindow',
      markdownDescription: "Echo mode: the client's response window after each model, as a multiple of the model's length (above 0, at most 10; default 1). A script's `@echo-window` line wins.",
    },
    apply(value, o) {
      const m = /^\s*(\d+(?:\.\d+)?|\.\d+)\s*(x|×)?\s*$/i.exec(value);
      const n = m ? Number(m[1]) : NaN;
      if (!m || !(n > 0) || n > 10) return `@echo-window is a multiple of the model's length above 0 and at most 10, e.g. "1", not "${value.trim()}"`;
      o.timing = { ...o.timing, echoWindow: n };
      return null;
    },
  },
];
