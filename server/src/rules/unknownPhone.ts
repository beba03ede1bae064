// unknown-phone: a pronunciation override with a phone that is not CMU ARPAbet.
// The core finds it while reading overrides (scripts and lexicon files alike); this file words it.
import { excerpt } from '../core/excerpt';
import { findingRule } from './findingRule';

export const unknownPhone = findingRule(
  {
    id: 'unknown-phone',
    summary: 'A `@say` override or lexicon line uses a phone that is not one of the 39 CMU ARPAbet phones.',
    defaultSeverity: 'error',
    category: 'item',
    docs: [
      'Overrides are written in the phone set of the CMU Pronouncing Dictionary: 39 ARPAbet phones,',
      'vowels with a stress digit 0, 1 or 2 (`M EH1 R IH0 S OW2 L`). A phone outside the set (for',
      'example `NX`, `AX` or `EL` from other ARPAbet variants, or a vowel without its stress digit) is',
      'reported at the phone with the reason. The whole override is then ignored, so the word falls',
      'back to the dictionary or to an estimate, which `estimated-word` reports. Lexicon files are',
      'checked the same way.',
    ].join(' '),
  },
  ['phone-not-arpabet'],
  (f) => ({ message: `"${excerpt(f.phone)}" is not a CMU ARPAbet phone: ${f.reason}` }),
);
