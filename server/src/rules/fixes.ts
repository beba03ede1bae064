// Applies fixes to text. A fix is applied whole or not at all: when any of its edits overlaps an
// edit already taken, the fix is skipped (a later run can pick it up). Identical edits from
// different problems (e.g. two reports of one unknown word) are applied once. Text outside the
// edits is copied unchanged, byte for byte.
import type { Fix, Problem, TextEdit } from '../core/types';

/**
 * Whether a fix may be applied without a person looking at it (`--fix`, fix-all). Fixes marked
 * `batch: false` remove an item or turn an estimate into an override: editor quick fixes only.
 */
export function isBatchFix(fix: Fix | undefined): fix is Fix {
  return fix !== undefined && fix.batch !== false;
}

/** The fixes `--fix` and fix-all apply: every batch fix of the problems, in their order. */
export function batchFixes(problems: Problem[]): Fix[] {
  return problems.flatMap((p) => (isBatchFix(p.fix) ? [p.fix] : []));
}

interface Span {
  start: number;
  end: number;
  newText: string;
}

function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '\n' || (c === '\r' && text[i + 1] !== '\n')) starts.push(i + 1);
  }
  return starts;
}

function offset(starts: number[], text: string, line: number, character: number): number {
  if (line >= starts.length) return text.length;
  return Math.min(starts[line] + character, text.length);
}

export function applyFixes(text: string, fixes: Fix[]): { text: string; applied: number; skipped: number } {
  const starts = lineStarts(text);
  const taken: Span[] = [];
  const keys = new Set<string>();
  let applied = 0;
  let skipped = 0;
  for (const fix of fixes) {
    const spans = fix.edits.map((e: TextEdit) => ({
      start: offset(starts, text, e.line, e.character),
      end: offset(starts, text, e.endLine, e.endCharacter),
      newText: e.newText,
    }));
    const fresh = spans.filter((s) => !keys.has(`${s.start}:${s.end}:${s.newText}`));
    if (!fresh.length) {
      applied++;
      continue;
    }
    const clash = fresh.some((s) =>
      taken.some((t) => s.start < t.end && t.start < s.end || (s.start === s.end && t.start === t.end && s.start === t.start)),
    );
    if (clash) {
      skipped++;
      continue;
    }
    for (const s of fresh) {
      taken.push(s);
      keys.add(`${s.start}:${s.end}:${s.newText}`);
    }
    applied++;
  }
  // Built in one pass from the start (splicing from the end copies the whole text per edit).
  taken.sort((a, b) => a.start - b.start || a.end - b.end);
  const parts: string[] = [];
  let at = 0;
  for (const s of taken) {
    parts.push(text.slice(at, s.start), s.newText);
    at = s.end;
  }
  parts.push(text.slice(at));
  return { text: parts.join(''), applied, skipped };
}
