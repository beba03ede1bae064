// Settings of the records side: the benefit mark, the filler list and the readiness rule. They
// live in AnalysisOptions (`options.records`) and are a block of the one settings table
// (core/settings.ts), read like every other setting (headers, config files).
import type { SettingSpec } from '../settings';
import { excerpt } from '../excerpt';
import { NUMBER_RANGES, outOfRange } from '../ranges';

export interface RecordsOptions {
  /** Paced/unassisted ratio that counts as a meaningful benefit (common practice: 1.2). */
  benefitMark: number;
  /** Words left out when counting a transcript (lower case). */
  fillers: string[];
  /** Consecutive latest sessions at or above the mark before a rung is called ready. */
  readySessions: number;
  /** Accuracy (correct / words, 0-1) those sessions must also reach; null when not used. */
  accuracyFloor: number | null;
}

/** Fillers usually left out of rate counts (common practice). */
export const DEFAULT_FILLERS = ['um', 'uh', 'er', 'erm', 'hmm'];

export function defaultRecordsOptions(): RecordsOptions {
  return { benefitMark: 1.2, fillers: [...DEFAULT_FILLERS], readySessions: 2, accuracyFloor: null };
}

const NUMBER = /^\s*(\d+(?:\.\d+)?|\.\d+)\s*$/;

const DEFAULTS = defaultRecordsOptions();

export const RECORDS_KEYS: SettingSpec[] = [
  {
    key: 'benefit-mark',
    aliases: [],
    scope: 'script',
    recordsOnly: true,
    type: 'number',
    default: DEFAULTS.benefitMark,
    range: NUMBER_RANGES['benefit-mark'],
    summary: 'Rate records: paced/unassisted words-per-second ratio that marks a meaningful benefit (default 1.2).',
    example: '1.2',
    editor: {
      name: 'records.benefitMark',
      markdownDescription:
        'Rate records (`*.rates.csv`): the paced/unassisted words-per-second ratio that marks a meaningful benefit from paced practice. Default 1.2 (20 % faster with the model; common practice). A config file beside the records file wins.',
    },
    apply(value, o) {
      const m = NUMBER.exec(value);
      if (!m || !(Number(m[1]) > 0)) return `@benefit-mark must be a number above 0, e.g. 1.2, not "${excerpt(value.trim())}"`;
      const range = outOfRange('benefit-mark', Number(m[1]));
      if (range) return range;
      o.records = { ...o.records, benefitMark: Number(m[1]) };
      return null;
    },
  },
  {
    key: 'fillers',
    aliases: [],
    scope: 'script',
    recordsOnly: true,
    type: 'labels',
    default: DEFAULTS.fillers.join(', '),
    summary: 'Rate records: words left out when counting a transcript (default um, uh, er, erm, hmm).',
    example: 'um, uh, er',
    editor: {
      name: 'records.fillers',
      markdownDescription: 'Rate records: words left out when the words of a `transcript` cell are counted, separated by commas. Default `um, uh, er, erm, hmm`.',
    },
    apply(value, o) {
      const words = value.split(/[,\s]+/).map((w) => w.trim().toLowerCase()).filter(Boolean);
      o.records = { ...o.records, fillers: words };
      return null;
    },
  },
  {
    key: 'ready-sessions',
    aliases: [],
    scope: 'script',
    recordsOnly: true,
    type: 'integer',
    default: DEFAULTS.readySessions,
    range: NUMBER_RANGES['ready-sessions'],
    summary: 'Rate records: latest sessions that must meet the mark before a rung is called ready (default 2).',
    example: '2',
    editor: {
      name: 'records.readySessions',
      markdownDescription: 'Rate records: how many latest sessions on a rung must meet the benefit mark before the trend says "consider the next rung". Default 2.',
    },
    apply(value, o) {
      const m = /^\s*(\d+)\s*$/.exec(value);
      if (!m || Number(m[1]) < 1) return `@ready-sessions must be a whole number, 1 or more, not "${excerpt(value.trim())}"`;
      const range = outOfRange('ready-sessions', Number(m[1]));
      if (range) return range;
      o.records = { ...o.records, readySessions: Number(m[1]) };
      return null;
    },
  },
  {
    key: 'accuracy-floor',
    aliases: [],
    scope: 'script',
    recordsOnly: true,
    type: 'number',
    // "none": no floor (null in the options).
    default: 'none',
    range: { min: 0, max: 1 },
    summary: 'Rate records: accuracy (correct/words) the ready sessions must reach too, 0-1 or a percentage (default none).',
    example: '80%',
    editor: {
      name: 'records.accuracyFloor',
      markdownDescription:
        'Rate records: accuracy (`correct` / `words`) the ready sessions must also reach, as a fraction (`0.8`) or a percentage (`"80%"`); `"none"` (default) sets no floor.',
      // A fraction, or the text forms "80%" and "none".
      schema: { type: ['number', 'string'] },
    },
    apply(value, o) {
      const v = value.trim();
      if (/^(none|off|no)$/i.test(v)) {
        o.records = { ...o.records, accuracyFloor: null };
        return null;
      }
      const m = /^(\d+(?:\.\d+)?|\.\d+)\s*(%?)$/.exec(v);
      const n = m ? Number(m[1]) / (m[2] ? 100 : 1) : NaN;
      if (!m || !(n >= 0 && n <= 1)) return `@accuracy-floor is a fraction 0-1 or a percentage, e.g. 0.8 or 80%, not "${excerpt(v)}"`;
      o.records = { ...o.records, accuracyFloor: n };
      return null;
    },
  },
];
