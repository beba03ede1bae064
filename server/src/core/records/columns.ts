// The columns of a records file: names are matched without regard to case or surrounding
// spaces, in any order. Data module: the validator and the docs read this table.

export const COLUMNS = ['date', 'client', 'script', 'rung', 'condition', 'words', 'seconds', 'pace', 'task', 'transcript', 'correct', 'note'] as const;
export type Column = (typeof COLUMNS)[number];

/** Columns a records file must have (`words` may be empty on a row with a transcript). */
export const REQUIRED_COLUMNS: readonly Column[] = ['date', 'client', 'script', 'rung', 'condition', 'words', 'seconds'];

/** The file-name ending the extension and `rungs progress` recognise as a records file. */
export const RECORDS_FILE_PATTERN = /\.rates\.(csv|tsv)$/i;
export const RECORDS_FILE_GLOB = '*.rates.csv, *.rates.tsv';

export function isRecordsFile(path: string): boolean {
  return RECORDS_FILE_PATTERN.test(path);
}

/**
 * Fastest plausible sustained rate, words per second: 8 (480 words per minute). A word has at
 * least one syllable, and the fastest mean syllable rate among the languages measured by
 * Pellegrino, Coupé & Marsico 2011 (Language 87(3)) is about 7.8 syllables/s (from memory), so a
 * higher word rate is almost surely a typing slip (minutes written as seconds, a lost digit).
 */
export const MAX_PLAUSIBLE_WPS = 8;
