// bad-directive: a `// rungs:` comment that names an unknown rule or is not understood.
// The reading lives in directives.ts beside it (lint() uses it to silence rules too).
import { readDirectives } from './directives';
import type { Rule } from './types';

export const badDirective: Rule = {
  id: 'bad-directive',
  summary: 'A `// rungs: allow ...` comment names a rule that does not exist or is malformed.',
  defaultSeverity: 'warning',
  category: 'format',
  docs: [
    'Directives silence rules where a problem is deliberate: `// rungs: allow item-outlier` for',
    'the next line that is not blank or a comment, `// rungs: allow-file pace-above-norm` for the',
    'whole script; several ids may be separated by commas or spaces (grammar/README.md,',
    '"Lint directives"). A directive with an unknown id (the nearest id is suggested, with a fix),',
    'an unknown verb, or no id is reported here and silences nothing for the bad part. A',
    'directive naming this rule cannot silence itself.',
  ].join(' '),
  check(ctx, report) {
    for (const p of readDirectives(ctx.analysis.script.comments, ctx.lines, ctx.ruleIds, badDirective.id).problems) report(p);
  },
};
