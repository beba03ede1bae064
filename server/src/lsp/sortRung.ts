// Sorting a rung by difficulty for the code action, the code lens and the `rungs.sortRung`
// command. The edit itself is the unsorted-rung rule's (rules/unsortedRung.ts): item lines move
// byte-identical with the comments directly above them, every other line keeps its place.
import type { RungAnalysis, TextEdit } from '../core/types';
import { lineEnding } from '../core/parse';
import { sortRungEdit } from '../rules/unsortedRung';
import type { Snapshot } from './documents';

/** The edit that sorts a rung, or null when it is already in order (or has fewer than two items). */
export function sortRung(s: Snapshot, rung: RungAnalysis): TextEdit | null {
  const dir = s.analysis.options.direction === 'falling' ? -1 : 1;
  const e = sortRungEdit({ analysis: s.analysis, lines: s.lines, text: s.text }, rung, dir);
  if (!e) return null;
  const current = s.lines.slice(e.line, e.endLine + 1).join(lineEnding(s.text));
  return current === e.newText ? null : e;
}
