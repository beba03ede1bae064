// `rungs pronounce WORD... [--estimate]`: each word's pronunciation and where it came from. With
// --estimate the dictionary (and morphology on its stems) is skipped and the trained estimator
// answers alone, so anyone can compare its guesses with the dictionary's entries.
import { rankNote } from '../core/g2p/estimator';
import { ALTERNATIVES, ESTIMATOR_HOW, HIATUS_HOW } from '../core/lts/estimate';
import { hiatusOf } from '../core/hiatus';
import { letterToSound } from '../core/lts/letterToSound';
import { tokenize } from '../core/tokenize';
import { toIpa } from '../core/phones';
import { countSyllables, Pronouncer, type Pronunciation } from '../core/pronounce';
import { DEFAULT_WCM_OPTIONS } from '../core/wcm';
import { loadWordTable } from '../data/wordTable';
import { parseArgs } from './args';
import { EXIT_OK, UsageError, type CliIO } from './io';
import type { Command } from './main';

const percent = (share: number): string => `${(100 * share).toFixed(share >= 0.1 ? 0 : 1)} %`;

function estimateOnly(word: string, data: ReturnType<typeof loadWordTable>): Pronunciation {
  // A diaeresis between two vowels (core/hiatus.ts): estimated with the vowels apart.
  const hiatus = hiatusOf(word);
  const spelling = hiatus?.plain ?? word;
  const candidates = data.estimate(spelling, ALTERNATIVES, undefined, hiatus?.at);
  const base = { variant: 0, variants: [], variantMissed: false };
  if (candidates !== undefined && candidates.length > 0) {
    return { ...base, phones: candidates[0].phones, source: 'estimate', how: hiatus ? HIATUS_HOW : ESTIMATOR_HOW, alternatives: candidates };
  }
  return { ...base, phones: letterToSound(spelling), source: 'estimate', how: 'letter-to-sound rules', alternatives: [] };
}

/** One block per word: phones, IPA, syllables, source, and the estimator's alternatives. */
export function formatPronunciation(word: string, p: Pronunciation): string {
  if (p.phones.length === 0) return `${word}\t(no estimate: no letter-to-sound rule applies)\n`;
  const n = countSyllables(p.phones);
  const source = p.source === 'dictionary' || p.source === 'override' ? p.how : `≈ estimated: ${p.source} (${p.how})`;
  const lines = [`${word}\t${p.phones.join(' ')}\t/${toIpa(p.phones)}/\t${n} syllable${n === 1 ? '' : 's'}\t${source}`];
  p.alternatives.forEach((c, i) => {
    const note = rankNote(c.phones);
    lines.push(`  ${i + 1}. ${c.phones.join(' ').padEnd(32)} ${percent(c.share).padStart(6)}   log10 p ${c.log10.toFixed(2)}${note ? `   (${note})` : ''}`);
  });
  return `${lines.join('\n')}\n`;
}

export const pronounceCommand: Command = {
  name: 'pronounce',
  summary: 'print the pronunciation of words and where it came from',
  usage: [
    'Usage: rungs pronounce WORD... [--estimate]',
    '',
    '  Reads each word as a script item would (Dr. is "doctor", 3 is "three", café is "cafe";',
    '  word(2) picks a listed pronunciation), then looks each spoken word up: the CMU Pronouncing',
    '  Dictionary, then morphology on a dictionary stem (a plural or possessive as it is; any other',
    "  reading weighed with the estimator's), an initialism with no vowel letter (NHS) letter by",
    '  letter, then the trained estimator (with its ranked alternatives and their shares).',
    '  --estimate  skip the dictionary and morphology: the estimator answers alone',
  ].join('\n'),
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, { estimate: { alias: 'e' } });
    if (!args.positionals.length) throw new UsageError('give at least one word');
    const data = loadWordTable();
    const pronouncer = new Pronouncer(data, [], DEFAULT_WCM_OPTIONS);
    for (const raw of args.positionals) {
      // Read as an item of a script reads it: "Dr." is spoken "doctor", "3:30" "three thirty",
      // "mother-in-law" as its parts, "café" as the dictionary spells it ("cafe"), "read(2)" with
      // its second listed pronunciation. Each spoken word is shown beside the argument when it
      // differs from it by more than case.
      const spoken = tokenize(raw).flatMap((t) => t.words.map((word, i) => ({ word, variant: i === t.words.length - 1 ? t.variant : null })));
      if (!spoken.length) io.stdout(`${raw}\t(no words to say)\n`);
      for (const { word, variant } of spoken) {
        const p = args.flags.has('estimate') ? estimateOnly(word, data) : pronouncer.pronounce(word, variant);
        io.stdout(formatPronunciation(word === raw.toLowerCase() ? word : `${raw} (as ${word})`, p));
      }
    }
    return EXIT_OK;
  },
};
