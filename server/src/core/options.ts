// Analysis options: built-in defaults, then a workspace config (already read into a plain object
// by the caller), then the script's own header. One table of keys drives parsing, validation,
// completion and docs, so they never disagree.
import { DEFAULT_WEIGHTS } from './difficulty';
import { makePace, parsePaces, READING_NORM_WPS } from './pace';
import { outOfRange } from './ranges';
import { DEFAULT_SET_OPTIONS, SET_KEYS } from './setOptions';
import type { AnalysisOptions, Direction, Problem, Setting } from './types';
import { DEFAULT_WCM_OPTIONS } from './wcm';
import { defaultRecordsOptions, RECORDS_KEYS } from './records/settings';
import { TIMING_KEYS } from './timingKeys';
import { DEFAULT_TIMING } from './timing';
import { excerpt } from './excerpt';

export function defaultOptions(): AnalysisOptions {
  return {
    paces: [makePace(1, 'wps'), makePace(1.5, 'wps'), makePace(2, 'wps')],
    baseline: null,
    direction: 'rising',
    maxStep: 15,
    minItems: 3,
    maxWords: 0,
    maxSyllables: 0,
    weights: { ...DEFAULT_WEIGHTS },
    wcm: { ...DEFAULT_WCM_OPTIONS },
    readingNormWps: READING_NORM_WPS,
    ...DEFAULT_SET_OPTIONS,
    // Rate records (records/settings.ts).
    records: defaultRecordsOptions(),
    timing: { ...DEFAULT_TIMING },
  };
}

export interface KeySpec {
  key: string;
  aliases: string[];
  /** Where the key may appear: the script header, a rung, or both. */
  scope: 'script' | 'rung' | 'both';
  summary: string;
  example: string;
  /** Values offered by completion. */
  values?: string[];
  /** Applies the value; returns an error message, or null when the value was read. */
  apply(value: string, o: AnalysisOptions): string | null;
}

export { NUMBER_RANGES, outOfRange, type NumberRange } from './ranges';

function positiveNumber(value: string, what: string, allowZero = false): number | string {
  const m = /^\s*(\d+(?:\.\d+)?|\.\d+)\s*$/.exec(value);
  const n = m ? Number(m[1]) : NaN;
  if (!m || Number.isNaN(n) || (!allowZero && n <= 0)) {
    return `${what} must be a ${allowZero ? 'number, 0 or more' : 'number above 0'}, not "${excerpt(value.trim())}"`;
  }
  return n;
}

function yesNo(value: string): boolean | null {
  const v = value.trim().toLowerCase();
  if (['yes', 'true', 'on', '1'].includes(v)) return true;
  if (['no', 'false', 'off', '0'].includes(v)) return false;
  return null;
}

function integerSetting(
  key: string,
  summary: string,
  example: string,
  set: (o: AnalysisOptions, n: number) => void,
): KeySpec {
  return {
    key,
    aliases: [],
    scope: 'script',
    summary,
    example,
    apply(value, o) {
      const n = positiveNumber(value, `@${key}`, true);
      if (typeof n === 'string') return n;
      if (!Number.isInteger(n) && Number.isFinite(n)) return `@${key} must be a whole number, not ${n}`;
      const range = outOfRange(key, n);
      if (range) return range;
      set(o, n);
      return null;
    },
  };
}

function flagSetting(key: string, summary: string, set: (o: AnalysisOptions, v: boolean) => void): KeySpec {
  return {
    key,
    aliases: [],
    scope: 'script',
    summary,
    example: 'yes',
    values: ['yes', 'no'],
    apply(value, o) {
      const v = yesNo(value);
      if (v === null) return `@${key} takes yes or no, not "${excerpt(value.trim())}"`;
      set(o, v);
      return null;
    },
  };
}

// `name = 0.4`: spaces taken atomically (a lookahead and a back-reference), so a long run of spaces
// after a name that is not followed by a number costs one pass, not one pass per space.
const WEIGHT = /(length|complexity|rarity)(?=(\s*))\2[=:]?(?=(\s*))\3(\d+(?:\.\d+)?)/gi;

export const KEYS: KeySpec[] = [
  {
    key: 'title',
    aliases: [],
    scope: 'script',
    summary: 'Name of the script, shown in reports.',
    example: 'Morning routine, week 3',
    apply: () => null,
  },
  {
    key: 'paces',
    aliases: ['pace'],
    scope: 'both',
    summary: 'Target paces: words per second (wps, the default unit) or syllables per second (sps).',
    example: '1, 1.5, 2 wps',
    values: ['1, 1.5, 2 wps', '4 sps'],
    apply(value, o) {
      const { paces, error } = parsePaces(value);
      if (error) return error;
      o.paces = paces;
      return null;
    },
  },
  {
    key: 'baseline',
    aliases: [],
    scope: 'script',
    summary: "The client's unassisted speech rate, in words per second.",
    example: '0.8 wps',
    apply(value, o) {
      const n = positiveNumber(value.replace(/(?<!\s)\s*(wps|w\/s|words\/s)\s*$/i, ''), '@baseline');
      if (typeof n === 'string') return `${n} (words per second, e.g. "0.8 wps")`;
      const range = outOfRange('baseline', n);
      if (range) return range;
      o.baseline = n;
      return null;
    },
  },
  {
    key: 'direction',
    aliases: [],
    scope: 'script',
    summary: 'Which way difficulty should go from rung to rung: rising (default) or falling.',
    example: 'rising',
    values: ['rising', 'falling'],
    apply(value, o) {
      const v = value.trim().toLowerCase();
      if (v !== 'rising' && v !== 'falling') return `@direction is rising or falling, not "${excerpt(value.trim())}"`;
      o.direction = v as Direction;
      return null;
    },
  },
  {
    key: 'max-step',
    aliases: ['largest-step'],
    scope: 'script',
    summary: 'Largest allowed change of median difficulty (0-100 points) between neighbouring rungs.',
    example: '15',
    apply(value, o) {
      const n = positiveNumber(value, '@max-step');
      if (typeof n === 'string') return n;
      const range = outOfRange('max-step', n);
      if (range) return range;
      o.maxStep = n;
      return null;
    },
  },
  integerSetting('min-items', 'Fewest items a rung should hold.', '3', (o, n) => (o.minItems = n)),
  integerSetting('max-words', 'Longest item in words (0 = no limit).', '12', (o, n) => (o.maxWords = n)),
  integerSetting('max-syllables', 'Longest item in syllables (0 = no limit).', '20', (o, n) => (o.maxSyllables = n)),
  {
    key: 'weights',
    aliases: [],
    scope: 'script',
    summary: 'Weights of the difficulty components: length, complexity, rarity.',
    example: 'length 0.4, complexity 0.4, rarity 0.2',
    apply(value, o) {
      const named = [...value.matchAll(WEIGHT)];
      const w = { ...o.weights };
      if (named.length) {
        for (const m of named) w[m[1].toLowerCase() as keyof typeof w] = Number(m[4]);
        const rest = value.replace(WEIGHT, '').replace(/[,\s]/g, '');
        if (rest) return `cannot read "${excerpt(rest)}" in @weights: write e.g. "length 0.4, complexity 0.4, rarity 0.2"`;
      } else {
        // Plain decimals only: Number() would also take "0x10", "Infinity" and "1e309".
        const nums = value.split(/[,\s]+/).filter(Boolean).map((x) => (/^(\d+(\.\d+)?|\.\d+)$/.test(x) ? Number(x) : NaN));
        if (nums.length !== 3 || nums.some((n) => Number.isNaN(n) || n < 0)) {
          return '@weights takes three numbers (length, complexity, rarity), e.g. "0.4, 0.4, 0.2"';
        }
        [w.length, w.complexity, w.rarity] = nums;
      }
      for (const part of ['length', 'complexity', 'rarity'] as const) {
        const range = outOfRange('weights', w[part], `the ${part} weight in @weights`);
        if (range) return range;
      }
      if (w.length + w.complexity + w.rarity <= 0) return '@weights must not all be 0';
      o.weights = w;
      return null;
    },
  },
  {
    key: 'set',
    aliases: ['sets'],
    scope: 'both',
    summary: 'Set labels (e.g. trained, untrained) for every item below, for matched-set checks.',
    example: 'trained',
    values: ['trained', 'untrained', 'control'],
    apply: () => null,
  },
  ...SET_KEYS,
  {
    key: 'reading-norm',
    aliases: [],
    scope: 'script',
    summary: 'Adult reading-aloud rate used to flag fast paces, words per second (default 3.05, Brysbaert 2019).',
    example: '3.05',
    apply(value, o) {
      const n = positiveNumber(value.replace(/(?<!\s)\s*wps\s*$/i, ''), '@reading-norm');
      if (typeof n === 'string') return n;
      const range = outOfRange('reading-norm', n);
      if (range) return range;
      o.readingNormWps = n;
      return null;
    },
  },
  flagSetting('wcm-h-fricative', 'Count /h/ as a fricative in the Word Complexity Measure (default no).', (o, v) => (o.wcm.hAsFricative = v)),
  flagSetting('wcm-syllable-clusters', 'Count only consonant clusters inside one syllable (default no: any run of consonants).', (o, v) => (o.wcm.clustersWithinSyllable = v)),
  flagSetting('wcm-secondary-stress', 'Secondary stress on the first syllable counts as initial stress (default no).', (o, v) => (o.wcm.secondaryStressIsInitial = v)),
  {
    key: 'say',
    aliases: [],
    scope: 'both',
    summary: 'Pronunciation override: a word and its ARPAbet phones, or the number of a listed variant.',
    example: 'Wojcik = W OY1 CH IH0 K',
    apply: () => null,
  },
  // Rate records: read from the config files beside or above a records file.
  ...RECORDS_KEYS,
  ...TIMING_KEYS,
];

const BY_NAME = new Map<string, KeySpec>();
for (const k of KEYS) for (const name of [k.key, ...k.aliases]) BY_NAME.set(name, k);

export function keySpec(name: string): KeySpec | undefined {
  return BY_NAME.get(name.toLowerCase());
}

/** Levenshtein distance, for "did you mean" suggestions. */
export function editDistance(a: string, b: string): number {
  const prev = Array.from({ length: b.length + 1 }, (_, i) => i);
  for (let i = 1; i <= a.length; i++) {
    let diag = prev[0];
    prev[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const tmp = prev[j];
      prev[j] = Math.min(prev[j] + 1, prev[j - 1] + 1, diag + (a[i - 1] === b[j - 1] ? 0 : 1));
      diag = tmp;
    }
  }
  return prev[b.length];
}

/** The nearest known key to a misspelt one, when it is close enough to be a likely typo. */
export function nearestKey(name: string): string | null {
  let best: string | null = null;
  let bestD = Infinity;
  for (const candidate of BY_NAME.keys()) {
    const d = editDistance(name.toLowerCase(), candidate);
    if (d < bestD) {
      bestD = d;
      best = candidate;
    }
  }
  return best !== null && bestD <= Math.max(2, Math.floor(name.length / 3)) ? keySpec(best)!.key : null;
}

function settingProblem(s: Setting, rule: string, message: string, onKey: boolean): Problem {
  return {
    rule,
    severity: 'error',
    message,
    line: s.line,
    character: onKey ? s.keyStart : s.valueStart,
    endLine: s.line,
    endCharacter: onKey ? s.keyEnd : Math.max(s.valueEnd, s.valueStart + 1),
  };
}

/**
 * Applies settings to options in order. Unknown keys and unreadable values become problems
 * (rules `unknown-key` and `bad-value`); an unknown key near a known one carries a fix.
 */
export function applySettings(
  base: AnalysisOptions,
  settings: Setting[],
  scope: 'script' | 'rung',
): { options: AnalysisOptions; problems: Problem[] } {
  const o: AnalysisOptions = { ...base, weights: { ...base.weights }, wcm: { ...base.wcm }, timing: { ...base.timing } };
  const problems: Problem[] = [];
  for (const s of settings) {
    const spec = keySpec(s.key);
    if (!spec) {
      const near = nearestKey(s.key);
      const p = settingProblem(
        s,
        'unknown-key',
        `unknown setting "@${excerpt(s.key)}"${near ? `; did you mean "@${near}"?` : ''}`,
        true,
      );
      if (near) {
        p.fix = {
          title: `Change "@${s.key}" to "@${near}"`,
          edits: [{ line: s.line, character: s.keyStart, endLine: s.line, endCharacter: s.keyEnd, newText: `@${near}` }],
        };
      }
      problems.push(p);
      continue;
    }
    if (scope === 'rung' && spec.scope === 'script') {
      problems.push(settingProblem(s, 'bad-value', `@${spec.key} applies to the whole script: put it in the header, above the first rung`, true));
      continue;
    }
    if (!s.value.trim() && spec.key !== 'title') {
      problems.push(settingProblem(s, 'bad-value', `@${spec.key} needs a value, e.g. "@${spec.key} ${spec.example}"`, true));
      continue;
    }
    const error = spec.apply(s.value, o);
    if (error) problems.push(settingProblem(s, 'bad-value', error, false));
  }
  return { options: o, problems };
}
