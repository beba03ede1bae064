// Resolves what a script is analysed with: built-in defaults, then workspace config files, then the
// script's own header (applied inside the core). Shared by the CLI and the language server so the
// editor and CI always agree.
import { defaultOptions } from '../core/options';
import type { AnalysisOptions, Override, Problem } from '../core/types';
import type { LintSettings } from '../rules/types';

export interface ScriptContext {
  options: AnalysisOptions;
  lexicon: Override[];
  lint: LintSettings;
  /** Problems in config or lexicon files, with the file they are in. */
  problems: { file: string; problem: Problem }[];
}

export interface ConfigFs {
  readFile(path: string): string;
  exists(path: string): boolean;
}

/** Context for one script path. (Config files are read in a later step of the resolver.) */
export function resolveScriptContext(_path: string, _fs: ConfigFs): ScriptContext {
  return { options: defaultOptions(), lexicon: [], problems: [], lint: { severities: {} } };
}
