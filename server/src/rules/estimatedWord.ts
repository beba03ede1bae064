// estimated-word: a word with no dictionary entry and no override, pronounced by estimate.
import { isEstimated } from '../core/pronounce';
import { lookupForm } from '../core/tokenize';
import type { TextEdit } from '../core/types';
import { eachRung, type Rule, type RuleContext } from './types';
import { excerpt } from '../core/excerpt';
import { eolOf, memo } from './shared';

/** Where a new `@say` line goes: after the last header line above the first rung or item. */
export function headerInsertEdit(ctx: RuleContext, line: string): TextEdit {
  const { script } = ctx.analysis;
  // The last setting line above the body, including @say lines the core could not read: found
  // once per lint run, since a script may have hundreds of estimated words.
  const last = memo(ctx, 'lastHeaderLine', () => {
    const firstBody = script.rungs.length ? script.rungs[0].line : ctx.lines.length;
    let found = -1;
    for (let l = 0; l < Math.min(firstBody, ctx.lines.length); l++) if (ctx.lines[l].trimStart().startsWith('@')) found = l;
    return found;
  });
  const eol = eolOf(ctx);
  if (last < 0) return { line: 0, character: 0, endLine: 0, endCharacter: 0, newText: line + eol };
  if (last + 1 < ctx.lines.length) return { line: last + 1, character: 0, endLine: last + 1, endCharacter: 0, newText: line + eol };
  const end = ctx.lines[last].length;
  return { line: last, character: end, endLine: last, endCharacter: end, newText: eol + line };
}

export const estimatedWord: Rule = {
  id: 'estimated-word',
  summary: 'A word is not in the dictionary and has no override, so its pronunciation is estimated.',
  defaultSeverity: 'warning',
  category: 'item',
  docs: [
    'Words missing from the CMU Pronouncing Dictionary (names, new words) are pronounced by',
    'morphology on a dictionary stem or by the trained estimator, and their syllables, phonemes and',
    'complexity are only as good as that estimate. Each such word is reported with the estimated',
    'phones. The quick fix inserts a `@say word = PHONES` line with the estimate at the end of the',
    'script header: check the phones and correct them if needed. `rungs lint --fix` and fix-all',
    'never apply it, because once written as an override the guess no longer shows as estimated.',
    'A word no English letter-to-sound rule applies to (Greek or Chinese script, for example) has',
    'no estimate: it is reported with no fix, and counts as 0 syllables until a `@say` line gives',
    'its phones. A workspace lexicon file (`lexicon` in a config file) does the same for many scripts.',
  ].join(' '),
  ...eachRung((ctx, r, report) => {
    for (const it of r.items) {
      // The item already counts its estimated words: most items have none to look through.
      if (it.estimatedWords === 0) continue;
      for (const w of it.words) {
        if (!isEstimated(w)) continue;
        const phones = w.phones.join(' ');
        // The word as the script writes it when a @say line of it matches (its lookup form is the
        // spoken word: "Anaïs"), else the spoken word (one part of "Jean-Luc", "doctor" for "Dr.").
        const word = lookupForm(w.surface) === w.spoken ? w.surface : w.spoken;
        const at = { line: it.node.line, character: w.start, endLine: it.node.line, endCharacter: w.end };
        if (!phones) {
          report({ ...at, message: `no English letter-to-sound rule applies to "${excerpt(word)}"; add a pronunciation with @say ${excerpt(word)} = PHONES` });
          continue;
        }
        const how = w.source === 'morphology' ? 'built from a dictionary stem' : 'estimated from its spelling';
        const say = `@say ${word} = ${phones}`;
        report({
          ...at,
          message: `"${excerpt(word)}" is not in the dictionary; ${how} as ${excerpt(phones, 80)} (${w.syllables} syllable${w.syllables === 1 ? '' : 's'}): check it and add "${excerpt(say, 120)}"`,
          // Writing a guess as an override hides that it is a guess: a person confirms each one.
          fix: { title: `Add "${excerpt(say, 120)}" to the header`, edits: [headerInsertEdit(ctx, say)], batch: false },
        });
      }
    }
  }),
};
