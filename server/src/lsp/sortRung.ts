// Sorting a rung by difficulty for the code action, the code lens and the `rungs.sortRung`
// command. The edit itself is the unsorted-rung rule's (rules/unsortedRung.ts): item lines move
// byte-identical with the comments directly above them, every other line keeps its place.
import type { RungAnalysis, TextEdit } from '../core/types';
import { lineBreaks } from '../core/parse';
import { sortRungEdit } from '../rules/unsortedRung';
import type { Snapshot } from './documents';

const needsSort = new WeakMap<RungAnalysis, boolean>();

/**
 * Whether sorting would change a rung, kept with the rung's analysis: the code lens asks on every
 * request, and the analysis of a rung an edit did not touch is the same object with the same lines.
 */
export function rungNeedsSort(s: Snapshot, rung: RungAnalysis): boolean {
  let v = needsSort.get(rung);
  if (v === undefined) needsSort.set(rung, (v = sortRung(s, rung) !== null));
  return v;
}

/** The edit that sorts a rung, or null when it is already in order (or has fewer than two items). */
export function sortRung(s: Snapshot, rung: RungAnalysis): TextEdit | null {
  const dir = s.analysis.options.direction === 'falling' ? -1 : 1;
  const e = sortRungEdit({ analysis: s.analysis, lines: s.lines, text: s.text }, rung, dir);
  if (!e) return null;
  const breaks = lineBreaks(s.text);
  const current = s.lines.slice(e.line, e.endLine + 1).map((l, i, a) => (i < a.length - 1 ? l + breaks[e.line + i] : l)).join('');
  return current === e.newText ? null : e;
}
