// unsorted-rung: items inside a rung that do not run from easiest to hardest.
import { lineEnding } from '../core/parse';
import type { RungAnalysis, TextEdit } from '../core/types';
import type { Rule, RuleContext } from './types';
import { fmt, rungLabel, rungRange, sign } from './shared';

/**
 * One edit that puts a rung's items in difficulty order. Each item moves as a whole line, with the
 * comment lines directly above it (no blank between); blank, setting and detached comment lines
 * keep their places. Lines are moved byte for byte, so nothing is lost or altered.
 */
export function sortRungEdit(ctx: Pick<RuleContext, 'analysis' | 'lines' | 'text'>, r: RungAnalysis, dir: 1 | -1): TextEdit | null {
  const { lines } = ctx;
  const comments = new Set(ctx.analysis.script.comments.map((c) => c.line));
  const blocks = r.items.map((it) => {
    let start = it.node.line;
    while (start - 1 > r.node.line - (r.node.implicit ? 1 : 0) && comments.has(start - 1)) start--;
    return { start, end: it.node.line, difficulty: it.difficulty };
  });
  if (blocks.length < 2) return null;
  const sorted = [...blocks].sort((a, b) => (a.difficulty - b.difficulty) * dir || a.start - b.start);
  const first = blocks[0].start;
  const last = blocks[blocks.length - 1].end;
  const out: string[] = [];
  let k = 0;
  for (let line = first; line <= last; line++) {
    const b = blocks[k];
    if (b && line === b.start) {
      const s = sorted[k++];
      for (let l = s.start; l <= s.end; l++) out.push(lines[l]);
      line = b.end;
    } else out.push(lines[line]);
  }
  const eol = lineEnding(ctx.text);
  return { line: first, character: 0, endLine: last, endCharacter: lines[last].length, newText: out.join(eol) };
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
  check(ctx, report) {
    const dir = sign(ctx);
    for (const r of ctx.analysis.rungs) {
      const at = r.items.findIndex((it, i) => i > 0 && (r.items[i - 1].difficulty - it.difficulty) * dir > 0.05);
      if (at < 0) continue;
      const it = r.items[at];
      const prev = r.items[at - 1];
      const edit = sortRungEdit(ctx, r, dir);
      report({
        ...rungRange(ctx, r),
        message:
          `${rungLabel(r)} is not in difficulty order: line ${it.node.line + 1} (${fmt(it.difficulty)}) is ` +
          `${dir === 1 ? 'easier' : 'harder'} than line ${prev.node.line + 1} (${fmt(prev.difficulty)}) before it`,
        related: [{ line: it.node.line, character: it.node.textStart, endLine: it.node.line, endCharacter: it.node.textEnd, message: `difficulty ${fmt(it.difficulty)}` }],
        fix: edit ? { title: `Sort ${rungLabel(r)} by difficulty`, edits: [edit] } : undefined,
      });
    }
  },
};
