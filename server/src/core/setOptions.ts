// Settings of the matched-set checks, kept together as a block of the settings table (settings.ts):
// `@set-bound` (equivalence bound in SD units), `@set-min-items` (fewest items a set needs to be
// tested) and `@set-scope` (compare sets over the whole script or rung by rung).
import type { SettingSpec } from './settings';
import type { SetScope } from './types';
import { excerpt } from './excerpt';
import { NUMBER_RANGES, outOfRange } from './ranges';

export interface SetOptions {
  setBound: number;
  setMinItems: number;
  setScope: SetScope;
}

/**
 * ±0.5 SD is a project convention, not a standard: a medium standardised difference is the
 * largest a matched pair of sets may plausibly hide. Five items is the fewest for which a set's
 * SD means anything; scripts are compared whole unless asked, as most trial designs match the
 * full sets.
 */
export const DEFAULT_SET_OPTIONS: SetOptions = { setBound: 0.5, setMinItems: 5, setScope: 'script' };

export const SET_SETTINGS: SettingSpec[] = [
  {
    key: 'set-bound',
    aliases: [],
    scope: 'script',
    type: 'number',
    default: DEFAULT_SET_OPTIONS.setBound,
    summary: 'Equivalence bound for matched sets, in standard deviations (default 0.5; a project convention).',
    example: '0.5',
    range: NUMBER_RANGES['set-bound'],
    editor: {
      name: 'sets.bound',
      markdownDescription:
        'Equivalence bound for matched sets (`@set`), in standard deviations of the pooled items: two sets count as matched on a measure when the difference of their means is shown to lie within ±bound SD. Default 0.5 (a project convention). A script\'s `@set-bound` line wins.',
    },
    apply(value, o) {
      // `(?:sd\s*)?$` rather than `(?:sd)?\s*$` after `\s*`: two runs of spaces side by side would
      // split a long run every possible way (quadratic).
      const m = /^\s*(\d+(?:\.\d+)?|\.\d+)\s*(?:sd\s*)?$/i.exec(value);
      const n = m ? Number(m[1]) : NaN;
      if (!(n > 0)) return `@set-bound must be a number of standard deviations above 0, e.g. "0.5", not "${excerpt(value.trim())}"`;
      const range = outOfRange('set-bound', n);
      if (range) return range;
      o.setBound = n;
      return null;
    },
  },
  {
    key: 'set-min-items',
    aliases: [],
    scope: 'script',
    type: 'integer',
    default: DEFAULT_SET_OPTIONS.setMinItems,
    summary: 'Fewest items a matched set needs before it is compared (default 5; at least 2).',
    example: '5',
    range: NUMBER_RANGES['set-min-items'],
    editor: {
      name: 'sets.minItems',
      markdownDescription: 'Fewest items a matched set needs before it is compared with the others (at least 2; default 5). A script\'s `@set-min-items` line wins.',
    },
    apply(value, o) {
      const v = value.trim();
      if (!/^\d+$/.test(v) || Number(v) < 2) return `@set-min-items must be a whole number, 2 or more, not "${excerpt(v)}"`;
      const range = outOfRange('set-min-items', Number(v));
      if (range) return range;
      o.setMinItems = Number(v);
      return null;
    },
  },
  {
    key: 'set-scope',
    aliases: [],
    scope: 'script',
    type: 'choice',
    default: DEFAULT_SET_OPTIONS.setScope,
    summary: 'Compare matched sets over the whole script (default) or rung by rung.',
    example: 'rung',
    values: ['script', 'rung'],
    editor: {
      name: 'sets.scope',
      markdownDescription: 'Compare matched sets over the whole script (`script`, default) or within each rung (`rung`). A script\'s `@set-scope` line wins.',
    },
    apply(value, o) {
      const v = value.trim().toLowerCase();
      if (v !== 'script' && v !== 'rung') return `@set-scope is script or rung, not "${value.trim()}"`;
      o.setScope = v;
      return null;
    },
  },
];
