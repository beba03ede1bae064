// Invented pseudowords for measuring syllable counts on words no dictionary lists. Their
// syllable counts were set by one rule before any estimator was run on them (computed by hand):
// one syllable per group of vowel letters (a e i o u), where a final e after a single consonant
// is silent. Words were built so the rule is unambiguous: no y, no -le, no vowel pairs that
// English splits (ia, eo). None is listed in the CMU Pronouncing Dictionary (checked in the test).
// "wug" is from Berko's 1958 test of English morphology (Word 14); the others are new.
export const PSEUDOWORDS: readonly (readonly [string, number])[] = [
  ['wug', 1],
  ['florp', 1],
  ['trand', 1],
  ['glim', 1],
  ['drosk', 1],
  ['sprunk', 1],
  ['gleme', 1],
  ['plote', 1],
  ['thrisk', 1],
  ['plig', 1],
  ['tasset', 2],
  ['lombet', 2],
  ['kappin', 2],
  ['bendrock', 2],
  ['mulpon', 2],
  ['gosket', 2],
  ['tranlet', 2],
  ['pobbin', 2],
  ['dremmon', 2],
  ['wistal', 2],
  ['caspet', 2],
  ['brindom', 2],
  ['tamiro', 3],
  ['pelomat', 3],
  ['fanderbin', 3],
  ['kolimber', 3],
  ['sutravan', 3],
  ['donalip', 3],
  ['mibbertoon', 3],
  ['gandoset', 3],
  ['talimoran', 4],
  ['pesodinal', 4],
  ['kanderobit', 4],
  ['mulavorent', 4],
  ['fosimandel', 4],
];
