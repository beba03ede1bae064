// A rule whose problems come from the core's or the config reader's findings: its check renders
// every finding of the kinds it owns, with its own wording, severity and fix.
import type { FindingKind, FindingOf } from '../core/findings';
import type { Described, Rule } from './types';

export function findingRule<K extends FindingKind>(
  meta: Omit<Rule, 'check' | 'kinds' | 'describe'>,
  kinds: readonly K[],
  describe: (f: FindingOf<K>) => Described,
): Rule & { kinds: readonly K[] } {
  const owns = (k: FindingKind): k is K => (kinds as readonly FindingKind[]).includes(k);
  const rule: Rule & { kinds: readonly K[] } = {
    ...meta,
    kinds,
    describe: (f) => {
      if (!owns(f.kind)) throw new Error(`${meta.id} does not render "${f.kind}" findings`);
      return describe(f as FindingOf<K>);
    },
    check(ctx, report) {
      for (const f of ctx.findings) {
        if (!owns(f.kind)) continue;
        report({ line: f.line, character: f.character, endLine: f.endLine, endCharacter: f.endCharacter, ...describe(f as FindingOf<K>) });
      }
    },
  };
  return rule;
}

/** "; did you mean "x"?" when there is a nearest name. */
export const didYouMean = (near: string | null, prefix = ''): string => (near ? `; did you mean "${prefix}${near}"?` : '');
