// bad-value: a setting value, or a line, that cannot be read.
// The core reports it, so the table of keys and their readers stays in one place (core/options.ts);
// this file holds the rule's metadata and docs.
import type { Rule } from './types';

export const badValue: Rule = {
  id: 'bad-value',
  summary: 'A setting value cannot be read (or a line cannot be parsed); the default stays in force.',
  defaultSeverity: 'error',
  category: 'format',
  docs: [
    'Reported at the value when it cannot be read for its key: a pace without a number, a unit',
    'per minute instead of per second, `@direction` other than rising or falling, a count that is',
    'not a whole number, `@weights` that are not three numbers of 0 or more or are all 0 (they',
    'need not add up to 1: the difficulty is their weighted mean), a script-wide key on a rung',
    'header, a `@say` line without phones, a note with no sentence before its `|`. The message says',
    'what the key expects, with an example. The setting is ignored and the default (or config',
    'value) stays in force. The same checks apply to values in config files.',
  ].join(' '),
  // Reported by the core's parser and settings reader (core/parse.ts, core/options.ts).
  check() {},
};
