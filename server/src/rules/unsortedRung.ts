// unsorted-rung: items inside a rung that do not run from easiest to hardest.
import { lineBreaks } from '../core/parse';
import type { RungAnalysis, TextEdit } from '../core/types';
import { eachRung, type Rule, type RuleContext } from './types';
import { fmt, memo, rungLabel, rungRange, sign } from './shared';

/**
 * One edit that puts a rung's items in difficulty order. Each item moves as a whole line, with the
 * comment lines directly above it (no blank between); blank, setting and detached comment lines
 * keep their places. Lines are moved byte for byte, so nothing is lost or altered.
 */
export function sortRungEdit(ctx: Pick<RuleContext, 'analysis' | 'lines' | 'text'>, r: RungAnalysis, dir: 1 | -1): TextEdit | null {
  const { lines } = ctx;
  const comments = memo(ctx, 'commentLines', () => new Set(ctx.analysis.script.comments.map((c) => c.line)));
  const blocks = r.items.map((it) => {
    let start = it.node.line;
    while (start - 1 > r.node.line - (r.node.implicit ? 1 : 0) && comments.has(start - 1)) start--;
    return { start, end: it.node.line, difficulty: it.difficulty };
  });
  if (blocks.length < 2) return null;
  const sorted = [...blocks].sort((a, b) => (a.difficulty - b.difficulty) * dir || a.start - b.start);
  const first = blocks[0].start;
  const last = blocks[blocks.length - 1].end;
  // Each block moves with the line breaks inside it; what lies between blocks (the break after a
  // block, blank and setting lines) stays where it is, byte for byte. So no line is lost or merged
  // in a file with CR, LF and CRLF breaks mixed (a CR moved before an empty LF line would merge).
  // Where each line starts in the text: the same for every rung of the analysis, so worked out once.
  const starts = memo(ctx, 'lineStarts', () => {
    const breaks = lineBreaks(ctx.text);
    const at: number[] = [0];
    for (let l = 0; l + 1 < lines.length; l++) at.push(at[l] + lines[l].length + breaks[l].length);
    return at;
  });
  const endOf = (l: number) => starts[l] + lines[l].length;
  const text = ctx.text;
  const parts: string[] = [];
  sorted.forEach((s, k) => {
    parts.push(text.slice(starts[s.start], endOf(s.end)));
    if (k + 1 < blocks.length) parts.push(text.slice(endOf(blocks[k].end), starts[blocks[k + 1].start]));
  });
  const newText = parts.join('');
  return { line: first, character: 0, endLine: last, endCharacter: lines[last].length, newText };
}

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
    let edit: TextEdit | null | undefined;
    const sorted = () => (edit === undefined ? (edit = sortRungEdit(ctx, r, dir)) : edit);
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
