// unsorted-rung: items inside a rung that do not run from easiest to hardest.
import type { TextEdit } from '../core/types';
import { eachRung, type Rule } from './types';
import { fmt, rungLabel, rungRange, sign } from './shared';
import { rungRegion, sortRegion } from './sortRegion';

export const unsortedRung: Rule = {
  id: 'unsorted-rung',
  summary: 'The items of a rung are not in order from easiest to hardest.',
  defaultSeverity: 'info',
  category: 'ladder',
  docs: [
    'Within a rung, practice usually starts with the easiest item. The rule reports a rung whose',
    'items are not in difficulty order (rising, or falling with `@direction falling`), naming the',
    'first item that is easier than the one before it. Its fix sorts the rung: each item line moves',
    'whole, with the comment lines directly above it, and blank lines, settings and every other line',
    'stay where they are. Turn the rule off when item order is deliberate (e.g. randomised).',
  ].join(' '),
  ...eachRung((ctx, r, report) => {
    const dir = sign(ctx);
    const at = r.items.findIndex((it, i) => i > 0 && (r.items[i - 1].difficulty - it.difficulty) * dir > 0.05);
    if (at < 0) return;
    const it = r.items[at];
    const prev = r.items[at - 1];
    // The sorted text of a rung is as long as the rung: it is built only when a fix is asked
    // for (a code action, --fix), not on every keystroke that re-lints the script.
    // It keeps the rung's lines, not the context: a kept problem must not hold the whole script.
    const region = rungRegion(ctx, r);
    let edit: TextEdit | null | undefined;
    const sorted = () => (edit === undefined ? (edit = sortRegion(region, r, dir)) : edit);
    report({
      ...rungRange(ctx, r),
      message:
        `${rungLabel(r)} is not in difficulty order: line ${it.node.line + 1} (${fmt(it.difficulty)}) is ` +
        `${dir === 1 ? 'easier' : 'harder'} than line ${prev.node.line + 1} (${fmt(prev.difficulty)}) before it`,
      related: [{ line: it.node.line, character: it.node.textStart, endLine: it.node.line, endCharacter: it.node.textEnd, message: `difficulty ${fmt(it.difficulty)}` }],
      // An unsorted rung has at least two items, so there is always a sorted order to write.
      fix: {
        title: `Sort ${rungLabel(r)} by difficulty`,
        get edits() {
          const e = sorted();
          return e ? [e] : [];
        },
      },
    });
  }),
};
