// Client rate records: the one module the edges import.
export { COLUMNS, isRecordsFile, MAX_PLAUSIBLE_WPS, RECORDS_FILE_GLOB, RECORDS_FILE_PATTERN, REQUIRED_COLUMNS } from './columns';
export { detectDelimiter, readCsv } from './csv';
export { meetsMark, readRecords, type ProgressInput, type RecordsReading } from './progress';
export { findRung, scriptFacts } from './scripts';
export { DEFAULT_FILLERS, defaultRecordsOptions, RECORDS_KEYS, type RecordsOptions } from './settings';
export type * from './types';
