// The one table of settings. Each entry is declared once: its key (as a script header writes it,
// `@max-step`, and as a config file writes it, `max-step`), aliases, where it may appear, its
// type, its default (written once, in the form an editor setting or config file holds it), a
// summary and example, the reader that applies a written value, a finite plausible range for
// numbers, and whether it changes item scores. From it come the header reader and the defaults
// (core/options.ts), config files (config/parseConfig.ts), the editor settings of the language
// server (lsp/settings.ts), completion and hovers, and package.json's `contributes.configuration`
// (tests/settings/table.test.ts fails when they differ).
import { DEFAULT_WEIGHTS } from './difficulty';
import { parsePaces, READING_NORM_WPS } from './pace';
import type { AnalysisOptions, Direction } from './types';
import { DEFAULT_WCM_OPTIONS } from './wcm';
import { RECORDS_KEYS } from './records/settings';
import { SET_SETTINGS } from './setOptions';
import { TIMING_KEYS } from './timingKeys';
import { excerpt } from './excerpt';
import { NUMBER_RANGES, outOfRange, type NumberRange } from './ranges';

export type SettingType = 'text' | 'paces' | 'rate' | 'number' | 'integer' | 'yes-no' | 'choice' | 'weights' | 'labels' | 'override';

export type { NumberRange };

/** How the VS Code extension offers a setting (`rungs.<name>` in package.json). */
export interface EditorForm {
  name: string;
  markdownDescription: string;
  /** Extra JSON-schema fields (e.g. a nested object's properties). */
  schema?: Record<string, unknown>;
}

export interface SettingSpec {
  key: string;
  aliases: string[];
  /** Where the key may appear in a script: the header, a rung, or both. */
  scope: 'script' | 'rung' | 'both';
  type: SettingType;
  /** The default in config-file form (a script-only key has none: null). */
  default: string | number | boolean | Record<string, number> | null;
  summary: string;
  example: string;
  /** Values offered by completion. */
  values?: string[];
  range?: NumberRange;
  /** Only in a script, never in a config file or editor settings (`@title`, `@say`, `@set`). */
  scriptOnly?: boolean;
  /**
   * Read for rate records only, from config files and editor settings beside the records file. A
   * script header never reaches a records file, so the key there is reported, not silently kept.
   */
  recordsOnly?: boolean;
  /** Reads the written value into options; returns an error message, or null when it was read. */
  apply(value: string, o: AnalysisOptions): string | null;
  /** The value in options that item scores depend on (the item cache is keyed on these). */
  scoring?: (o: AnalysisOptions) => unknown;
  editor?: EditorForm;
}

/**
 * A plain decimal written on its own (never hex, exponents or Infinity), above 0 or, with
 * `allowZero`, 0 or more; an error message otherwise.
 */
function positiveNumber(value: string, what: string, allowZero = false): number | string {
  const m = /^\s*(\d+(?:\.\d+)?|\.\d+)\s*$/.exec(value);
  const n = m ? Number(m[1]) : NaN;
  if (!m || Number.isNaN(n) || (!allowZero && n <= 0)) {
    return `${what} must be a ${allowZero ? 'number, 0 or more' : 'number above 0'}, not "${excerpt(value.trim())}"`;
  }
  return n;
}

/**
 * The reader of a number setting above 0: an optional unit word (`unit`) removed, then the number
 * within the key's range (core/ranges.ts); `hint` follows a message about the form.
 */
function numberReader(key: string, set: (o: AnalysisOptions, n: number) => void, unit?: RegExp, hint = ''): SettingSpec['apply'] {
  return (value, o) => {
    const n = positiveNumber(unit ? value.replace(unit, '') : value, `@${key}`);
    if (typeof n === 'string') return `${n}${hint}`;
    const range = outOfRange(key, n);
    if (range) return range;
    set(o, n);
    return null;
  };
}

function yesNo(value: string): boolean | null {
  const v = value.trim().toLowerCase();
  if (['yes', 'true', 'on', '1'].includes(v)) return true;
  if (['no', 'false', 'off', '0'].includes(v)) return false;
  return null;
}

function integerSetting(key: string, summary: string, example: string, dflt: number, set: (o: AnalysisOptions, n: number) => void): SettingSpec {
  return {
    key,
    aliases: [],
    scope: 'script',
    type: 'integer',
    default: dflt,
    summary,
    example,
    range: NUMBER_RANGES[key],
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

function wcmFlag(key: string, field: keyof AnalysisOptions['wcm'], summary: string, editorDescription: string): SettingSpec {
  return {
    key,
    aliases: [],
    scope: 'script',
    type: 'yes-no',
    default: DEFAULT_WCM_OPTIONS[field],
    summary,
    example: 'yes',
    values: ['yes', 'no'],
    apply(value, o) {
      const v = yesNo(value);
      if (v === null) return `@${key} takes yes or no, not "${excerpt(value.trim())}"`;
      o.wcm[field] = v;
      return null;
    },
    scoring: (o) => o.wcm[field],
    editor: { name: `wcm.${field}`, markdownDescription: editorDescription },
  };
}

const WEIGHT_RANGE = NUMBER_RANGES.weights;
const weightSchema = (description: string) => ({ type: 'number', minimum: WEIGHT_RANGE.min, maximum: WEIGHT_RANGE.max, description });

// `name = 0.4`: spaces taken atomically (a lookahead and a back-reference), so a long run of spaces
// after a name that is not followed by a number costs one pass, not one pass per space.
const WEIGHT = /(length|complexity|rarity)(?=(\s*))\2[=:]?(?=(\s*))\3(\d+(?:\.\d+)?)/gi;

export const SETTINGS: SettingSpec[] = [
  {
    key: 'title',
    aliases: [],
    scope: 'script',
    type: 'text',
    default: null,
    summary: 'Name of the script, shown in reports.',
    example: 'Morning routine, week 3',
    scriptOnly: true,
    apply: () => null,
  },
  {
    key: 'paces',
    aliases: ['pace'],
    scope: 'both',
    type: 'paces',
    default: '1, 1.5, 2 wps',
    summary: 'Target paces: words per second (wps, the default unit) or syllables per second (sps).',
    example: '1, 1.5, 2 wps',
    values: ['1, 1.5, 2 wps', '4 sps'],
    apply(value, o) {
      const { paces, error } = parsePaces(value);
      if (error) return error;
      o.paces = paces;
      return null;
    },
    scoring: (o) => o.paces.map((p) => p.label),
    editor: {
      name: 'paces',
      markdownDescription:
        'Target paces for scripts that set none, written as in a script header: numbers with a unit, `wps` (words per second, the default unit) or `sps` (syllables per second). A `@paces` line in the script wins.',
    },
  },
  {
    key: 'baseline',
    aliases: [],
    scope: 'script',
    type: 'rate',
    default: null,
    summary: "The client's unassisted speech rate, in words per second.",
    example: '0.8 wps',
    range: NUMBER_RANGES.baseline,
    apply: numberReader('baseline', (o, n) => (o.baseline = n), /(?<!\s)\s*(wps|w\/s|words\/s)\s*$/i, ' (words per second, e.g. "0.8 wps")'),
    scoring: (o) => o.baseline,
    editor: {
      name: 'baseline',
      markdownDescription: "The client's unassisted rate in words per second, used when a script has no `@baseline` line. `null`: unknown.",
    },
  },
  {
    key: 'direction',
    aliases: [],
    scope: 'script',
    type: 'choice',
    default: 'rising',
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
    type: 'number',
    default: 15,
    summary: 'Largest allowed change of median difficulty (0-100 points) between neighbouring rungs.',
    example: '15',
    range: NUMBER_RANGES['max-step'],
    apply: numberReader('max-step', (o, n) => (o.maxStep = n)),
    editor: {
      name: 'maxStep',
      markdownDescription: 'Largest change of median difficulty between neighbouring rungs, in points of the 0-100 scale, when a script has no `@max-step` line.',
    },
  },
  integerSetting('min-items', 'Fewest items a rung should hold.', '3', 3, (o, n) => (o.minItems = n)),
  integerSetting('max-words', 'Longest item in words (0 = no limit).', '12', 0, (o, n) => (o.maxWords = n)),
  integerSetting('max-syllables', 'Longest item in syllables (0 = no limit).', '20', 0, (o, n) => (o.maxSyllables = n)),
  integerSetting('max-phonemes', 'Longest item in phonemes (0 = no limit).', '40', 0, (o, n) => (o.maxPhonemes = n)),
  {
    key: 'weights',
    aliases: [],
    scope: 'script',
    type: 'weights',
    default: { ...DEFAULT_WEIGHTS },
    summary: 'Weights of the difficulty components: length, complexity, rarity.',
    example: 'length 0.4, complexity 0.4, rarity 0.2',
    range: WEIGHT_RANGE,
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
    scoring: (o) => o.weights,
    editor: {
      name: 'weights',
      markdownDescription: 'Weights of the three components of the composite difficulty, when a script has no `@weights` line.',
      schema: {
        properties: {
          length: weightSchema('Weight of length (syllables).'),
          complexity: weightSchema('Weight of articulatory complexity (Word Complexity Measure per word).'),
          rarity: weightSchema('Weight of word rarity (SUBTLEX-US Zipf).'),
        },
        additionalProperties: false,
      },
    },
  },
  {
    key: 'set',
    aliases: ['sets'],
    scope: 'both',
    type: 'labels',
    default: null,
    summary: 'Set labels (e.g. trained, untrained) for every item below, for matched-set checks.',
    example: 'trained',
    values: ['trained', 'untrained', 'control'],
    scriptOnly: true,
    apply: () => null,
  },
  ...SET_SETTINGS,
  {
    key: 'reading-norm',
    aliases: [],
    scope: 'script',
    type: 'rate',
    default: READING_NORM_WPS,
    summary: 'Adult reading-aloud rate used to flag fast paces, words per second (default 3.05, Brysbaert 2019).',
    example: '3.05',
    range: NUMBER_RANGES['reading-norm'],
    apply: numberReader('reading-norm', (o, n) => (o.readingNormWps = n), /(?<!\s)\s*wps\s*$/i),
    scoring: (o) => o.readingNormWps,
  },
  wcmFlag('wcm-h-fricative', 'hAsFricative', 'Count /h/ as a fricative in the Word Complexity Measure (default no).', 'Word Complexity Measure: count /h/ as a fricative (`@wcm-h-fricative` in a script).'),
  wcmFlag(
    'wcm-syllable-clusters',
    'clustersWithinSyllable',
    'Count only consonant clusters inside one syllable (default no: any run of consonants).',
    'Word Complexity Measure: count only consonant clusters inside one syllable, not any run of consonants (`@wcm-syllable-clusters`).',
  ),
  wcmFlag(
    'wcm-secondary-stress',
    'secondaryStressIsInitial',
    'Secondary stress on the first syllable counts as initial stress (default no).',
    'Word Complexity Measure: secondary stress on the first syllable counts as initial stress (`@wcm-secondary-stress`).',
  ),
  {
    key: 'say',
    aliases: [],
    scope: 'both',
    type: 'override',
    default: null,
    summary: 'Pronunciation override: a word and its ARPAbet phones, or the number of a listed variant.',
    example: 'Wojcik = W OY1 CH IH0 K',
    scriptOnly: true,
    apply: () => null,
  },
  // Rate records: read from the config files beside or above a records file.
  ...RECORDS_KEYS,
  // The timing plan of cue tracks, model audio and the practice page (core/timingKeys.ts).
  ...TIMING_KEYS,
];

const BY_NAME = new Map<string, SettingSpec>();
for (const k of SETTINGS) for (const name of [k.key, ...k.aliases]) BY_NAME.set(name, k);

export function settingSpec(name: string): SettingSpec | undefined {
  return BY_NAME.get(name.toLowerCase());
}

/** Every key and alias (for "did you mean"). */
export const SETTING_NAMES: readonly string[] = [...BY_NAME.keys()];

/** Keys a rung may carry (inline on its header or on `@` lines before its items). */
export const RUNG_KEYS: ReadonlySet<string> = new Set(SETTINGS.filter((s) => s.scope !== 'script').flatMap((s) => [s.key, ...s.aliases]));

/** A config or editor value as the text a script header would hold: `[1, 1.5]` -> "1, 1.5", yes/no for booleans. */
export function settingText(v: unknown): string | null {
  if (typeof v === 'string') return v;
  if (typeof v === 'number') return String(v);
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (Array.isArray(v) && v.every((x) => typeof x === 'string' || typeof x === 'number')) return v.join(', ');
  if (v && typeof v === 'object') {
    const parts = Object.entries(v as Record<string, unknown>);
    if (parts.every(([, x]) => typeof x === 'number')) return parts.map(([k, x]) => `${k} ${x}`).join(', ');
  }
  return null;
}

/**
 * The built-in options: every setting's default, read by its own reader. Read once; each caller
 * gets its own copy (callers adjust their options), which is cheaper than reading the table again
 * for every script of a library.
 */
export function defaultOptions(): AnalysisOptions {
  defaults ??= readDefaults();
  return structuredClone(defaults);
}

let defaults: AnalysisOptions | undefined;

function readDefaults(): AnalysisOptions {
  const o = { baseline: null, wcm: {}, weights: {}, records: {}, timing: {} } as unknown as AnalysisOptions;
  for (const s of SETTINGS) {
    const text = settingText(s.default);
    if (text === null) continue;
    const error = s.apply(text, o);
    if (error) throw new Error(`the default of @${s.key} does not read: ${error}`);
  }
  return o;
}

/** The part of the options item scores depend on: the item cache's key, from the table. */
export function scoringKey(o: AnalysisOptions): string {
  return JSON.stringify(SETTINGS.filter((s) => s.scoring).map((s) => s.scoring!(o)));
}
