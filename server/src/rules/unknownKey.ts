// unknown-key: a setting whose key Rungs does not know, with the nearest known key as a fix.
import type { Rule } from './types';

export const unknownKey: Rule = {
  id: 'unknown-key',
  summary: 'A setting (`@key`) or config-file key is not one Rungs knows; the nearest key is offered.',
  defaultSeverity: 'error',
  category: 'format',
  docs: [
    'Every `@key` line in a script, every setting on a rung header and every key of a config file',
    'must be one of the documented settings (grammar/README.md). An unknown key is reported on the',
    'key with the nearest known key when one is close (edit distance up to a third of its length,',
    'at least 2), and the fix replaces the key with it, leaving the value as written. The setting',
    'is otherwise ignored, so the default stays in force: a misspelt `@pacse` silently keeps the',
    'default paces, which is why this is an error.',
  ].join(' '),
  // The core reports this while reading settings (core/options.ts), so scripts and config files
  // share one table of keys; the rule carries the metadata.
  check() {},
};
