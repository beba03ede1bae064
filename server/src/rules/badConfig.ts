// bad-config: a workspace config or lexicon file that cannot be read as intended.
// The config reader and resolver find it (server/src/config/); this file words it.
import type { Described } from './types';
import { didYouMean, findingRule } from './findingRule';
import { excerpt } from '../core/excerpt';

export const badConfig = findingRule(
  {
    id: 'bad-config',
    summary: 'A config file (`.rungs.json`, `.rungs.yaml`, `.rungs.yml`) or lexicon it names cannot be read.',
    defaultSeverity: 'error',
    category: 'format',
    docs: [
      'Config files are JSON or YAML, never code. This rule reports, with the file, line and column:',
      'a syntax error (a `.rungs.json` file must be strict JSON: no comments, no comma after the last',
      'entry); a top-level value that is not an object; an unknown rule id under `rules`',
      '(with the nearest id) or a severity other than error, warning, info, hint or off; a `ladder`',
      'block with an unknown metric or a bad `maxStep`; a `lexicon` entry that is not a string,',
      'names a file that does not exist or is not a regular file, or lies outside the folder of the',
      'config file that names it (for editor settings: outside the workspace folder); a config or',
      'lexicon file larger than 32 MiB. Settings keys and values in a config file are checked like',
      'script settings and reported as `unknown-key` and `bad-value`. Whatever cannot be read is',
      'ignored and the rest of the file still applies. After a YAML syntax error, the top-level entry',
      'the error falls in counts as unreadable (it may be misread); after a JSON syntax error, the',
      'whole file does, since a JSON reader gives no partial result.',
    ].join(' '),
  },
  [
    'config-syntax',
    'config-not-object',
    'config-unreadable',
    'config-entry-shape',
    'unknown-rule',
    'bad-severity',
    'lexicon-missing',
    'lexicon-unreadable',
    'lexicon-refused',
  ],
  (f): Described => {
    switch (f.kind) {
      case 'config-syntax':
        return { message: `cannot read the config file: ${f.explanation}` };
      case 'config-not-object':
        return { message: 'a config file holds an object of settings, e.g. {"max-step": 12}' };
      case 'config-unreadable':
        return { message: `cannot read the config file (${f.code})` };
      case 'config-entry-shape':
        return { message: f.expected };
      case 'unknown-rule': {
        const message = `unknown rule "${excerpt(f.name)}"${didYouMean(f.nearest)}`;
        if (!f.nearest || !f.fixable) return { message };
        const { line, character, endLine, endCharacter } = f;
        return { message, fix: { title: `Change "${excerpt(f.name)}" to "${f.nearest}"`, edits: [{ line, character, endLine, endCharacter, newText: f.nearest }] } };
      }
      case 'bad-severity':
        return { message: `the severity of "${f.ruleId}" is one of ${f.choices.join(', ')}, not ${excerpt(JSON.stringify(f.value) ?? String(f.value))}` };
      case 'lexicon-missing':
        return { message: `lexicon file "${excerpt(f.name)}" does not exist (looked for ${excerpt(f.path, 200)})` };
      case 'lexicon-unreadable':
        return { message: `cannot read lexicon file "${excerpt(f.name)}" (${f.code})` };
      case 'lexicon-refused':
        return { message: `lexicon file "${excerpt(f.name)}" ${f.reason}` };
    }
  },
);
