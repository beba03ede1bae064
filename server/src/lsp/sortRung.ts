// Sorting a rung by difficulty for the code action, the code lens and the `rungs.sortRung`
// command. The edit itself is the unsorted-rung rule's (rules/unsortedRung.ts): item lines move
// byte-identical with the comments directly above them, every other line keeps its place.
import type { RungAnalysis, TextEdit } from '../core/types';
import { rungRegion, sortRegion } from '../rules/sortRegion';
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
  // The rung's own lines, so asking whether a rung needs sorting reads that rung, not the script.
  const region = rungRegion({ analysis: s.analysis, lines: s.lines, text: s.text }, rung);
  const e = sortRegion(region, rung, dir);
  if (!e) return null;
  const parts: string[] = [];
  for (let l = e.line; l <= e.endLine; l++) parts.push(region.lines[l - region.first], l < e.endLine ? region.breaks[l - region.first] : '');
  return parts.join('') === e.newText ? null : e;
}
