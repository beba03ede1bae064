// duplicate-item: the same sentence written twice in one script.
import type { ItemAnalysis, ItemNode, TextEdit } from '../core/types';
import type { Report, Rule, RuleContext } from './types';
import { itemRange, rungLabel } from './shared';
import { excerpt } from '../core/excerpt';
import { repeatsOf } from './repeats';

export const duplicateItem: Rule = {
  id: 'duplicate-item',
  summary: 'An item repeats an earlier item of the script.',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'Compares the spoken text of every item (before any `|` trailer), ignoring case, punctuation,',
    'spacing and the accents of Latin letters (a diaeresis too), so "Come in." and "come in!"',
    'are the same item, and so are "Café au lait." and "cafe au lait". Each repeat is reported with the',
    'line and rung of the first one. A repeated item counts twice in its rung\'s median and in',
    'matched-set checks. The repeat is marked unnecessary (shown faded in editors). The quick fix',
    'removes the repeated line (and only that line, with its note, id and sets); `rungs lint --fix`',
    'and fix-all never apply it, because a repeat can be deliberate (a probe rung may repeat an',
    'item). When it is, allow it with a `// rungs: allow duplicate-item` line above it.',
  ].join(' '),
  check(ctx, report) {
    for (const { item, first } of repeatsOf(ctx.analysis.rungs)) report(repeatReport(ctx, item, first));
  },
};

type RepeatReport = Parameters<Report>[0];

/**
 * The report on a repeat, kept with the repeated item's parse while what it says holds (the same
 * first item, rung label and removal edit): lint() then hands on the same problem object, and the
 * language server sends the diagnostic it converted before.
 */
const reports = new WeakMap<ItemNode, { first: ItemNode; label: string; edit: TextEdit; report: RepeatReport }>();

function repeatReport(ctx: RuleContext, it: ItemAnalysis, first: ItemAnalysis): RepeatReport {
  const label = rungLabel(ctx.analysis.rungs[first.rung]);
  const line = it.node.line;
  const last = line + 1 >= ctx.lines.length;
  const edit: TextEdit =
    last && line > 0
      ? { line: line - 1, character: ctx.lines[line - 1].length, endLine: line, endCharacter: ctx.lines[line].length, newText: '' }
      : { line, character: 0, endLine: line + 1, endCharacter: 0, newText: '' };
  const hit = reports.get(it.node);
  const e = hit?.edit;
  if (hit && hit.first === first.node && hit.label === label && e!.line === edit.line && e!.character === edit.character && e!.endLine === edit.endLine && e!.endCharacter === edit.endCharacter) {
    return hit.report;
  }
  const report: RepeatReport = {
    ...itemRange(it),
    message: `"${excerpt(it.node.text)}" repeats line ${first.node.line + 1} in ${label}`,
    related: [{ ...itemRange(first), message: `first written here, in ${label}` }],
    unnecessary: true,
    fix: {
      title: `Remove the repeated "${excerpt(it.node.text)}"`,
      // Removing an item (with its note, id and sets) is a person's choice, one repeat at a time.
      batch: false,
      edits: [edit],
    },
  };
  reports.set(it.node, { first: first.node, label, edit, report });
  return report;
}
