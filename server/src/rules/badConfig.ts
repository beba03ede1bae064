// bad-config: a workspace config or lexicon file that cannot be read as intended.
import type { Rule } from './types';

export const badConfig: Rule = {
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
  // Reported by the config resolver (server/src/config/resolve.ts).
  check() {},
};
