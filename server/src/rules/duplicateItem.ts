// duplicate-item: the same sentence written twice in one script.
import type { ItemAnalysis } from '../core/types';
import type { Rule } from './types';
import { itemRange, rungLabel } from './shared';
import { excerpt } from '../core/excerpt';

/**
 * Two items are the same when their spoken words match, ignoring case, punctuation and spacing:
 * the key is the text in lower case with every run of other characters one space. Worked out
 * afresh on every run: for the usual plain item that is one scan and one lower-casing, cheaper
 * than remembering keys by item or text across runs (filling a cache of 10,000 keys on a fresh
 * analysis costs more than the keys themselves).
 */
export function spokenKey(text: string): string {
  return plainSpokenKey(text) ?? generalSpokenKey(text);
}

export function generalSpokenKey(text: string): string {
  return text
    .toLowerCase()
    .replace(/[’‘ʼ]/g, "'")
    .replace(/[^\p{L}\p{N}'()]+/gu, ' ')
    .trim();
}

/** ASCII letters, digits, ' ( and ): what the general key keeps of ASCII text. */
function kept(c: number): boolean {
  return (c >= 0x61 && c <= 0x7a) || (c >= 0x41 && c <= 0x5a) || (c >= 0x30 && c <= 0x39) || c === 0x27 || c === 0x28 || c === 0x29;
}

/**
 * The key of the usual item without a regular expression: ASCII words separated by single spaces,
 * with any punctuation only at the end ("My sister bought the bread."). Its key is its lower-case
 * text up to the last kept character. Anything else (null) takes the general key;
 * tests/rules/duplicateKey.property.test.ts checks the two agree on arbitrary text.
 */
function plainSpokenKey(text: string): string | null {
  const n = text.length;
  let end = 0;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0x80) return null;
    if (!kept(c)) continue;
    // Between two kept characters only one space may stand; nothing may stand before the first.
    if (i !== end && (end === 0 || i !== end + 1 || text.charCodeAt(end) !== 0x20)) return null;
    end = i + 1;
  }
  return text.slice(0, end).toLowerCase();
}

export const duplicateItem: Rule = {
  id: 'duplicate-item',
  summary: 'An item repeats an earlier item of the script.',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'Compares the spoken text of every item (before any `|` trailer), ignoring case, punctuation',
    'and spacing, so "Come in." and "come in!" are the same item. Each repeat is reported with the',
    'line and rung of the first one. A repeated item counts twice in its rung\'s median and in',
    'matched-set checks. The repeat is marked unnecessary (shown faded in editors). The quick fix',
    'removes the repeated line (and only that line, with its note, id and sets); `rungs lint --fix`',
    'and fix-all never apply it, because a repeat can be deliberate (a probe rung may repeat an',
    'item). When it is, allow it with a `// rungs: allow duplicate-item` line above it.',
  ].join(' '),
  check(ctx, report) {
    const seen = new Map<string, ItemAnalysis>();
    for (const it of ctx.analysis.items) {
      const key = spokenKey(it.node.text);
      if (!key) continue;
      const first = seen.get(key);
      if (!first) {
        seen.set(key, it);
        continue;
      }
      const firstRung = ctx.analysis.rungs[first.rung];
      const line = it.node.line;
      const last = line + 1 >= ctx.lines.length;
      report({
        ...itemRange(it),
        message: `"${excerpt(it.node.text)}" repeats line ${first.node.line + 1} in ${rungLabel(firstRung)}`,
        related: [{ ...itemRange(first), message: `first written here, in ${rungLabel(firstRung)}` }],
        unnecessary: true,
        fix: {
          title: `Remove the repeated "${excerpt(it.node.text)}"`,
          // Removing an item (with its note, id and sets) is a person's choice, one repeat at a time.
          batch: false,
          edits: [
            last && line > 0
              ? { line: line - 1, character: ctx.lines[line - 1].length, endLine: line, endCharacter: ctx.lines[line].length, newText: '' }
              : { line, character: 0, endLine: line + 1, endCharacter: 0, newText: '' },
          ],
        },
      });
    }
  },
};
