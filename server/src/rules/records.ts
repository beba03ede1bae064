// Rate records with their problems in words: the records core (core/records/) reads the file and
// returns typed findings; the records rules (badRecord, recordsHeader, duplicateRecord,
// recordsSyntax) word them here, the same way for the CLI, the language server and renderers.
import { readRecords, type ProgressInput } from '../core/records/progress';
import type { RecordsOptions } from '../core/records/settings';
import type { ProgressResult, ScriptLookup } from '../core/records/types';
import type { WordData } from '../core/types';
import { renderFindings } from './index';

/** Rates, ratios and trends of one records file, with its problems. Never throws on what the file holds. */
export function readProgress(input: ProgressInput): ProgressResult {
  const { findings, ...read } = readRecords(input);
  return { ...read, problems: renderFindings(findings) };
}

export interface ProgressFile {
  /** The records file as it should be shown (a path). */
  file: string;
  text: string;
  /** Finds scripts relative to this records file. */
  scripts: ScriptLookup;
}

/**
 * Progress of several records files: each is read on its own (a paced row is compared with
 * unassisted rows of the same file). The entry point for reports and other renderers.
 */
export function readProgressFiles(
  files: ProgressFile[],
  options: { today: string; records?: RecordsOptions; data?: WordData },
): (ProgressResult & { file: string })[] {
  return files.map((f) => ({ file: f.file, ...readProgress({ text: f.text, scripts: f.scripts, options: options.records, today: options.today, data: options.data }) }));
}
