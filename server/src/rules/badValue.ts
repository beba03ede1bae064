// bad-value: a setting value, or a line, that cannot be read.
// The core's parser and settings reader and the config reader find it (with what the key takes);
// this file words it.
import { excerpt } from '../core/excerpt';
import type { Described } from './types';
import { findingRule } from './findingRule';

export const badValue = findingRule(
  {
    id: 'bad-value',
    summary: 'A setting value cannot be read (or a line cannot be parsed); the default stays in force.',
    defaultSeverity: 'error',
    category: 'format',
    docs: [
      'Reported at the value when it cannot be read for its key: a pace without a number, a unit',
      'per minute instead of per second, `@direction` other than rising or falling, a count that is',
      'not a whole number, `@weights` that are not three numbers of 0 or more or are all 0 (they',
      'need not add up to 1: the difficulty is their weighted mean), a script-wide key on a rung',
      'header, a rate-records key (`@benefit-mark`, `@fillers`, `@ready-sessions`, `@accuracy-floor`)',
      'in a script header, where it reaches no records file (a warning: put it in a config file beside',
      'the records), a `@say` line without phones, a note with no sentence before its `|`. The message says',
      'what the key expects, with an example. The setting is ignored and the default (or config',
      'value) stays in force. The same checks apply to values in config files.',
    ].join(' '),
  },
  [
    'script-key-on-rung',
    'records-key-in-script',
    'missing-value',
    'unreadable-value',
    'setting-without-key',
    'note-without-sentence',
    'override-without-phones',
    'script-only-key',
    'unreadable-config-value',
  ],
  (f): Described => {
    switch (f.kind) {
      case 'script-key-on-rung':
        return { message: `@${f.key} applies to the whole script: put it in the header, above the first rung` };
      case 'records-key-in-script':
        // Nothing is lost (the key never did anything in a script), so this one is a warning.
        return {
          message: `@${f.key} is a rate-records setting and a script header does not reach records files: put "${f.key}" in a config file (.rungs.json or .rungs.yaml) beside the records file`,
          severity: 'warning',
        };
      case 'missing-value':
        return { message: `@${f.key} needs a value, e.g. "@${f.key} ${f.example}"` };
      case 'unreadable-value':
        return { message: f.expected };
      case 'setting-without-key':
        return { message: 'a setting line needs a key after "@", e.g. "@paces 1.5, 2 wps"' };
      case 'note-without-sentence':
        // Nothing is lost but the note's item, so this one is a warning.
        return { message: 'this line has a note but no sentence before the "|"', severity: 'warning' };
      case 'override-without-phones':
        return { message: 'a pronunciation needs a word and its phones, e.g. "Wojcik = W OY1 CH IH0 K", or a listed variant number, e.g. "record = 2"' };
      case 'script-only-key':
        return { message: `"${excerpt(f.key)}" belongs in a script, not in a config file${f.key.toLowerCase() === 'say' ? ' (put pronunciations in a lexicon file)' : ''}` };
      case 'unreadable-config-value':
        return { message: `cannot read the value of "${excerpt(f.key)}": write it as in a script, e.g. "${f.example}"` };
    }
  },
);
