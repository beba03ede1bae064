// unused-override: a script `@say` line whose word no item ever speaks.
import type { Rule } from './types';
import { excerpt } from '../core/excerpt';
import { plainSpelling } from '../core/hiatus';

/** Why a written word can never be looked up as one spoken word, when its spelling says so. */
function whyNever(word: string): string {
  const reasons: string[] = [];
  if (/[-‐‑]/.test(word)) reasons.push('a hyphenated word is looked up as its parts');
  if (word.includes('.')) reasons.push('a full stop is never part of a spoken word (abbreviations are expanded)');
  if (/\d/.test(word)) reasons.push('digits are spoken as words ("3" is "three")');
  return reasons.length ? `: items are looked up word by word, and ${reasons.join(', and ')}` : '';
}

export const unusedOverride: Rule = {
  id: 'unused-override',
  summary: "A script's `@say` line names a word that no item speaks, so it changes nothing.",
  defaultSeverity: 'warning',
  category: 'format',
  docs: [
    'Pronunciations are looked up one spoken word at a time, after expansion: hyphenated compounds',
    'are split into their parts (`mother-in-law` is looked up as mother, in, law), abbreviations',
    'and numbers are spelt out (`Dr.` is spoken "doctor", `3` is "three"). A `@say` line in the',
    'script whose word never occurs as a spoken word of any item has no effect, and the words it',
    'was meant for keep their dictionary or estimated pronunciation. The rule reports the word on',
    'its `@say` line and, for a hyphen, a full stop or a digit, says why it cannot match. Write the',
    'override for the spoken word (`@say law = ...`, `@say doctor = ...`), or delete it if the',
    'item it was for is gone. Workspace lexicon files are shared by many scripts and not checked.',
  ].join(' '),
  check(ctx, report) {
    // Most scripts have no @say line: then there is nothing to look for in 80,000 words.
    if (!ctx.analysis.script.overrides.length) return;
    const spoken = new Set<string>();
    // A spoken "anaïs" also uses an override written "@say Anais" (core/pronounce.ts override).
    for (const it of ctx.analysis.items) for (const w of it.words) spoken.add(w.spoken).add(plainSpelling(w.spoken));
    for (const o of ctx.analysis.script.overrides) {
      if (spoken.has(o.word)) continue;
      report({
        line: o.line,
        character: o.character,
        endLine: o.line,
        endCharacter: o.character + o.written.length,
        // The word as written on the @say line (the key is its lookup form: lower case, no accents).
        message: `"${excerpt(o.written)}" is never spoken as a word in any item, so this @say line is not used${whyNever(o.word)}`,
        unnecessary: true,
      });
    }
  },
};
