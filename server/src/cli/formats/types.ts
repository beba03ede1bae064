// The one result type every `rungs lint` format is a function of.
import type { Problem } from '../../core/types';

export interface LintFileResult {
  /** The file as shown: relative to the working folder, with forward slashes; `<stdin>` for "-". */
  file: string;
  problems: Problem[];
}

export interface LintRun {
  version: string;
  results: LintFileResult[];
}

export function counts(problems: Problem[]): { error: number; warning: number; info: number; hint: number } {
  const c = { error: 0, warning: 0, info: 0, hint: 0 };
  for (const p of problems) c[p.severity]++;
  return c;
}
