// Where each number of the report comes from (data, shown under every script).
export interface MetricSource {
  measure: string;
  definition: string;
  source: string;
}

export const METRIC_SOURCES: MetricSource[] = [
  { measure: 'Words', definition: 'spoken words after expansion of numbers, times and abbreviations', source: 'project convention' },
  { measure: 'Syllables, phonemes', definition: 'vowel phones and all phones of the pronunciation', source: 'CMU Pronouncing Dictionary (npm cmu-pronouncing-dictionary 3.0.0); estimates: Elovitz et al. 1976, NRL Report 7948' },
  { measure: 'WCM', definition: 'Word Complexity Measure, eight parameters, summed over the item', source: 'Stoel-Gammon 2010, Clinical Linguistics & Phonetics 24(4-5)' },
  { measure: 'Zipf', definition: 'log10((count + 1) / (51 + 0.074286)) + 3; mean and minimum over the item; low: words below 3', source: 'van Heuven et al. 2014, QJEP 67(6); counts from SUBTLEX-US, Brysbaert & New 2009' },
  { measure: 'Duration', definition: 'words / pace (words per second) or syllables / pace (syllables per second)', source: 'arithmetic; pauses and phrase-final lengthening left out' },
  { measure: 'Reading norm', definition: '3.05 words per second (183 words per minute)', source: 'Brysbaert 2019, Journal of Memory and Language 109' },
  { measure: 'Difficulty', definition: '0-100, weighted mean of length, complexity and rarity; rank 1 = easiest in its rung', source: 'project convention, not a validated clinical scale' },
];
