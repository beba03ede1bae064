// unknown-key: a setting whose key Rungs does not know, with the nearest known key as a fix.
// The core (script settings) and the config reader (config-file keys) find it; this file words it.
import { excerpt } from '../core/excerpt';
import { didYouMean, findingRule } from './findingRule';

export const unknownKey = findingRule(
  {
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
  },
  ['unknown-setting'],
  (f) => {
    // A script writes keys with "@", a config file without.
    const at = f.where === 'script' ? '@' : '';
    const message = `unknown ${f.where === 'script' ? 'setting' : 'key'} "${at}${excerpt(f.key)}"${didYouMean(f.nearest, at)}`;
    if (!f.nearest || !f.fixable) return { message };
    const { line, character, endLine, endCharacter } = f;
    return { message, fix: { title: `Change "${at}${excerpt(f.key)}" to "${at}${f.nearest}"`, edits: [{ line, character, endLine, endCharacter, newText: `${at}${f.nearest}` }] } };
  },
);
