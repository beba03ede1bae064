// The sort of a rung (unsorted-rung's fix, the code lens and the sort command) worked out from the
// rung's own lines. A rung's problems are kept while the rung is unchanged, and the sorted text is
// built only when a fix is asked for; keeping the rung's lines instead of the whole script's text
// means a kept problem holds on to its rung only, not to every version of the script it saw.
import { lineBreaks } from '../core/parse';
import type { RungAnalysis, TextEdit } from '../core/types';
import type { RuleContext } from './types';
import { memo } from './shared';

/** A rung's lines (its first line through its last item), the break after each, and its comment lines. */
export interface RungRegion {
  first: number;
  lines: string[];
  breaks: string[];
  comments: Set<number>;
}

export function rungRegion(ctx: Pick<RuleContext, 'analysis' | 'lines' | 'text'>, r: RungAnalysis): RungRegion {
  const first = r.node.line;
  const last = r.items.length ? r.items[r.items.length - 1].node.line : first;
  const lines = ctx.lines.slice(first, last + 1);
  // Most scripts break lines with "\n" alone; only a script with a carriage return is searched for its breaks.
  const mixed = memo(ctx, 'hasCarriageReturn', () => ctx.text.includes('\r'));
  const breaks = mixed
    ? memo(ctx, 'lineBreaks', () => lineBreaks(ctx.text)).slice(first, last + 1)
    : lines.map((_, i) => (first + i + 1 < ctx.lines.length ? '\n' : ''));
  const comments = new Set<number>();
  for (const c of ctx.analysis.script.comments) if (c.line >= first && c.line <= last) comments.add(c.line);
  return { first, lines, breaks, comments };
}

/**
 * One edit that puts a rung's items in difficulty order. Each item moves as a whole line, with the
 * comment lines directly above it (no blank between); blank, setting and detached comment lines
 * keep their places. Lines are moved byte for byte, so nothing is lost or altered.
 */
export function sortRegion(g: RungRegion, r: RungAnalysis, dir: 1 | -1): TextEdit | null {
  const line = (l: number) => g.lines[l - g.first];
  const brk = (l: number) => g.breaks[l - g.first];
  const blocks = r.items.map((it) => {
    let start = it.node.line;
    while (start - 1 > r.node.line - (r.node.implicit ? 1 : 0) && g.comments.has(start - 1)) start--;
    return { start, end: it.node.line, difficulty: it.difficulty };
  });
  if (blocks.length < 2) return null;
  const sorted = [...blocks].sort((a, b) => (a.difficulty - b.difficulty) * dir || a.start - b.start);
  const first = blocks[0].start;
  const last = blocks[blocks.length - 1].end;
  // Each block moves with the line breaks inside it; what lies between blocks (the break after a
  // block, blank and setting lines) stays where it is, byte for byte. So no line is lost or merged
  // in a file with CR, LF and CRLF breaks mixed (a CR moved before an empty LF line would merge).
  const parts: string[] = [];
  sorted.forEach((s, k) => {
    for (let l = s.start; l <= s.end; l++) parts.push(line(l), l < s.end ? brk(l) : '');
    if (k + 1 < blocks.length) {
      parts.push(brk(blocks[k].end));
      for (let l = blocks[k].end + 1; l < blocks[k + 1].start; l++) parts.push(line(l), brk(l));
    }
  });
  return { line: first, character: 0, endLine: last, endCharacter: line(last).length, newText: parts.join('') };
}
