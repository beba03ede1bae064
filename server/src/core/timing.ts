// The timing plan of paced delivery: when each item and each word of a session is spoken. Cue
// tracks, model audio, the practice page, hovers, lenses and `rungs score` all read this one plan,
// so they can never disagree about a time.
//
// An item lasts words / pace (syllables / pace for a syllable pace), as the projected durations
// do. Inside it every written word gets a slot in proportion to its syllables (or an equal slot per
// spoken word), and phrase-break punctuation may add a pause after a word. Items are separated by a
// gap; in echo mode the model is followed by a response window for the client. All times are in
// seconds from the start of the plan.
import { formatNumber, makePace } from './pace';
import type { Analysis, ItemAnalysis, Pace, RungAnalysis, TimingOptions } from './types';

export type DeliveryMode = 'unison' | 'echo';

export const DEFAULT_TIMING: TimingOptions = {
  slots: 'syllables',
  phrasePause: 0,
  gap: 2,
  echoWindow: 1,
};

/** One written word (a token such as "12" may stand for several spoken words). */
export interface PlannedWord {
  /** The word as written. */
  text: string;
  /** 0-based line and character offsets of the written token. */
  line: number;
  start: number;
  end: number;
  /** Spoken words this token stands for ("12" -> "twelve" is 1; "21" is 2). */
  words: number;
  syllables: number;
  /** Start and end of the word's slot, in seconds from the start of the plan. */
  onset: number;
  offset: number;
  /** True when phrase-break punctuation follows the word (a pause may follow it). */
  phraseBreak: boolean;
}

export interface PlannedItem {
  /** 0-based line of the item. */
  line: number;
  id: string | null;
  /** The item as written, and the character where it starts on its line. */
  text: string;
  textStart: number;
  /** Index of the item's rung in the analysis. */
  rung: number;
  pace: Pace;
  /** Start and end of the model (speech plus phrase pauses). */
  start: number;
  end: number;
  /** The client's response window after the model (echo mode), or null. */
  response: { start: number; end: number } | null;
  words: PlannedWord[];
}

export interface PlannedRung {
  index: number;
  name: string;
  line: number;
  pace: Pace;
  start: number;
  /** End of the rung's last item (including its response window). */
  end: number;
  items: PlannedItem[];
}

export interface SessionPlan {
  mode: DeliveryMode;
  timing: TimingOptions;
  rungs: PlannedRung[];
  /** Every planned item, in order. */
  items: PlannedItem[];
  /** Total length with gaps, in seconds. */
  seconds: number;
}

export interface PlanRequest {
  /** Plan one rung only (index into analysis.rungs); default every rung with items. */
  rung?: number;
  /** Use this pace for every item instead of each rung's first pace. */
  pace?: Pace;
  mode?: DeliveryMode;
  /** Start time of the first item (default 0). */
  offset?: number;
}

/** Punctuation after a word that marks a phrase break: comma, colon, semicolon, dashes, sentence ends. */
const PHRASE_BREAK = /[,;:.!?\u2013\u2014]|\s-\s/;

/**
 * Word slots of one item, relative to the item's start (0). Words written as one token are merged
 * (a number spoken as two words keeps one slot of twice the weight). Returns the slots and the
 * model's length including phrase pauses.
 */
export function planItemWords(item: ItemAnalysis, pace: Pace, timing: TimingOptions): { words: PlannedWord[]; seconds: number } {
  const tokens: PlannedWord[] = [];
  for (const w of item.words) {
    const last = tokens[tokens.length - 1];
    if (last && last.start === w.start && last.end === w.end) {
      last.words += 1;
      last.syllables += w.syllables;
      continue;
    }
    tokens.push({ text: w.surface, line: item.node.line, start: w.start, end: w.end, words: 1, syllables: w.syllables, onset: 0, offset: 0, phraseBreak: false });
  }
  const text = item.node.text;
  tokens.forEach((t, i) => {
    const next = tokens[i + 1];
    if (!next) return;
    // The characters between this word and the next; an abbreviation's own dot is inside the word.
    const between = text.slice(t.end - item.node.textStart, next.start - item.node.textStart);
    t.phraseBreak = PHRASE_BREAK.test(between);
  });
  const speech = pace.unit === 'wps' ? item.wordCount / pace.value : item.syllables / pace.value;
  const weight = (t: PlannedWord) => (timing.slots === 'equal' ? t.words : Math.max(t.syllables, 1));
  const totalWeight = tokens.reduce((s, t) => s + weight(t), 0);
  let at = 0;
  tokens.forEach((t, i) => {
    t.onset = at;
    at += totalWeight > 0 ? (speech * weight(t)) / totalWeight : 0;
    t.offset = at;
    if (t.phraseBreak && i < tokens.length - 1) at += timing.phrasePause;
  });
  return { words: tokens, seconds: at };
}

function shift(words: PlannedWord[], by: number): PlannedWord[] {
  return words.map((w) => ({ ...w, onset: w.onset + by, offset: w.offset + by }));
}

/**
 * Where the session stands after an item of `seconds` that starts at `start`: at its end in
 * unison, after the client's response window in echo mode. planSession and the kept rung lengths
 * both step with it, so the two sums are made of the same additions.
 */
function afterItem(start: number, seconds: number, timing: TimingOptions, mode: DeliveryMode): number {
  const end = start + seconds;
  return mode === 'echo' ? end + seconds * timing.echoWindow : end;
}

/**
 * The session plan of an analysed script: every rung with items (or the one asked for), each item
 * at its rung's first pace (or the pace asked for), items separated by the gap, and in echo mode a
 * response window after each model. This is the function other outputs (cue tracks, audio, the
 * practice page, printed reports) call: analysis and request in, plain data out.
 */
export function planSession(analysis: Analysis, request: PlanRequest = {}): SessionPlan {
  const timing = analysis.options.timing;
  const mode = request.mode ?? 'unison';
  const rungs: PlannedRung[] = [];
  const items: PlannedItem[] = [];
  let at = request.offset ?? 0;
  for (const r of analysis.rungs) {
    if (request.rung !== undefined && r.index !== request.rung) continue;
    if (!r.items.length) continue;
    const pace = request.pace ?? r.paces[0] ?? analysis.options.paces[0] ?? makePace(1, 'wps');
    if (items.length) at += timing.gap;
    const rung: PlannedRung = { index: r.index, name: r.node.name, line: r.node.line, pace, start: at, end: at, items: [] };
    r.items.forEach((it, k) => {
      if (k > 0) at += timing.gap;
      const { words, seconds } = planItemWords(it, pace, timing);
      const start = at;
      const end = start + seconds;
      at = afterItem(start, seconds, timing, mode);
      const response: PlannedItem['response'] = mode === 'echo' ? { start: end, end: at } : null;
      const planned: PlannedItem = { line: it.node.line, id: it.node.id, text: it.node.text, textStart: it.node.textStart, rung: r.index, pace, start, end, response, words: shift(words, start) };
      rung.items.push(planned);
      items.push(planned);
    });
    rung.end = at;
    rungs.push(rung);
  }
  const start = request.offset ?? 0;
  return { mode, timing, rungs, items, seconds: items.length ? at - start : 0 };
}

export interface RungLength {
  index: number;
  name: string;
  line: number;
  /** One entry per pace of the rung: length of the rung with gaps at that pace, in seconds. */
  paces: { pace: Pace; seconds: number }[];
}

export interface SessionLengths {
  mode: DeliveryMode;
  rungs: RungLength[];
  /** The whole script at each of the script's paces, rungs one after another with gaps. */
  script: { pace: Pace; seconds: number }[];
}

/**
 * A rung's plan length at a pace, kept with the rung's analysis by mode, timing settings and pace:
 * what a rung's plan reads is its own items and those, so the code lens and hovers plan a rung
 * once, and an edit plans again only the rungs it touched.
 */
const secondsByRung = new WeakMap<RungAnalysis, Map<string, number>>();

function rungSeconds(analysis: Analysis, r: RungAnalysis, pace: Pace, mode: DeliveryMode): number {
  let m = secondsByRung.get(r);
  if (!m) secondsByRung.set(r, (m = new Map()));
  const timing = analysis.options.timing;
  const paceKey = `${pace.value}|${pace.unit}|${JSON.stringify(timing)}`;
  const key = `${mode}|${paceKey}`;
  let seconds = m.get(key);
  if (seconds === undefined) {
    // planSession's sum for one rung, stepped by the same afterItem, so the same number
    // (tests/core/timing.test.ts holds the two equal), with each item's length kept with its words.
    let at = 0;
    r.items.forEach((it, k) => {
      if (k > 0) at += timing.gap;
      at = afterItem(at, itemSeconds(it, pace, timing, paceKey), timing, mode);
    });
    m.set(key, (seconds = at));
  }
  return seconds;
}

/**
 * An item's model length at a pace (planItemWords), kept with its words: a rung an edit touched is
 * analysed again, but its other items keep their words (the item cache), so working out the
 * rung's length again plans only the edited item rather than all of the rung's items.
 */
const secondsByWords = new WeakMap<object, Map<string, number>>();

function itemSeconds(it: ItemAnalysis, pace: Pace, timing: TimingOptions, paceKey: string): number {
  let m = secondsByWords.get(it.words);
  if (!m) secondsByWords.set(it.words, (m = new Map()));
  let s = m.get(paceKey);
  if (s === undefined) m.set(paceKey, (s = planItemWords(it, pace, timing).seconds));
  return s;
}

/** One rung's session length with gaps at each of its paces. */
export function rungLength(analysis: Analysis, index: number, mode: DeliveryMode = 'unison'): RungLength {
  const r = analysis.rungs[index];
  return { index, name: r.node.name, line: r.node.line, paces: r.paces.map((pace) => ({ pace, seconds: rungSeconds(analysis, r, pace, mode) })) };
}

/**
 * The whole script's plan length at one pace: the rungs with items one after another, a gap
 * between each two (planSession's sum, taken rung by rung from the rungs' kept lengths).
 */
function scriptSeconds(analysis: Analysis, pace: Pace, mode: DeliveryMode): number {
  let total = 0;
  let any = false;
  for (const r of analysis.rungs) {
    if (!r.items.length) continue;
    if (any) total += analysis.options.timing.gap;
    total += rungSeconds(analysis, r, pace, mode);
    any = true;
  }
  return total;
}

/** Session lengths per rung (at each of its paces) and for the whole script (at each script pace). */
export function sessionLengths(analysis: Analysis, mode: DeliveryMode = 'unison'): SessionLengths {
  const rungs = analysis.rungs.map((r) => rungLength(analysis, r.index, mode));
  const script = analysis.options.paces.map((pace) => ({ pace, seconds: scriptSeconds(analysis, pace, mode) }));
  return { mode, rungs, script };
}

/** "3 min 40 s", "45 s", "1.5 s": a session length for people. */
export function formatLength(seconds: number): string {
  if (seconds < 10) return `${formatNumber(seconds, 1)} s`;
  const whole = Math.round(seconds);
  const m = Math.floor(whole / 60);
  const s = whole - m * 60;
  return m ? `${m} min${s ? ` ${s} s` : ''}` : `${s} s`;
}

/** "3 min 40 s at 1 wps, 2 min 30 s at 1.5 wps": a rung's or a script's lengths in one line. */
export function describeLengths(paces: { pace: Pace; seconds: number }[]): string {
  return paces.map((p) => `${formatLength(p.seconds)} at ${p.pace.label}`).join(', ');
}

/** "rung 2 at 1.2 wps: 3 min 40 s with gaps". */
export function describeRungLength(rung: RungLength, k: number): string {
  const p = rung.paces[k];
  return `rung ${rung.index + 1} at ${p.pace.label}: ${formatLength(p.seconds)} with gaps`;
}
