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

/** The edits of fixes chosen whole (see the header), in document order, with what was left out. */
function chooseEdits(text: string, fixes: Fix[]): { edits: TextEdit[]; spans: Span[]; applied: number; skipped: number } {
  const starts = lineStarts(text);
  const taken: { span: Span; edit: TextEdit }[] = [];
  const keys = new Set<string>();
  let applied = 0;
  let skipped = 0;
  for (const fix of fixes) {
    const spans = fix.edits.map((e: TextEdit) => ({
      edit: e,
      span: { start: offset(starts, text, e.line, e.character), end: offset(starts, text, e.endLine, e.endCharacter), newText: e.newText },
    }));
    const fresh = spans.filter(({ span: s }) => !keys.has(`${s.start}:${s.end}:${s.newText}`));
    if (!fresh.length) {
      applied++;
      continue;
    }
    // Touching edits (one ends where the next starts) are both taken; two insertions at one point
    // clash, since their order would be a guess.
    const clash = fresh.some(({ span: s }) =>
      taken.some(({ span: t }) => (s.start < t.end && t.start < s.end) || (s.start === s.end && t.start === t.end && s.start === t.start)),
    );
    if (clash) {
      skipped++;
      continue;
    }
    for (const f of fresh) {
      taken.push(f);
      keys.add(`${f.span.start}:${f.span.end}:${f.span.newText}`);
    }
    applied++;
  }
  // Document order; at one offset an insertion comes before the replacement starting there, which
  // is the order both an LSP client and applyEdits below give it.
  taken.sort((a, b) => a.span.start - b.span.start || a.span.end - b.span.end);
  return { edits: taken.map((t) => t.edit), spans: taken.map((t) => t.span), applied, skipped };
}

/**
 * The one batch of edits `rungs lint --fix` and the editor's fix-all apply to a text: every batch
 * fix of the problems, whole or not at all, in document order. Both edges call this, so they make
 * exactly the same change.
 */
export function batchEdits(text: string, problems: Problem[]): TextEdit[] {
  return chooseEdits(text, batchFixes(problems)).edits;
}

export function applyFixes(text: string, fixes: Fix[]): { text: string; applied: number; skipped: number } {
  const { spans, applied, skipped } = chooseEdits(text, fixes);
  // Built in one pass from the start (splicing from the end copies the whole text per edit); an
  // insertion at a replacement's start was sorted before it and so lands in front of its new text.
  const parts: string[] = [];
  let at = 0;
  for (const s of spans) {
    parts.push(text.slice(at, s.start), s.newText);
    at = s.end;
  }
  parts.push(text.slice(at));
  return { text: parts.join(''), applied, skipped };
}
