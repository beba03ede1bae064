// Shared test access to the compiled word table (built by `npm run build`, which `npm test` runs).
import { loadWordTable } from '../../server/src/data/wordTable';
import { analyze, type AnalyzeOutput } from '../../server/src/core/analyze';
import type { AnalysisOptions } from '../../server/src/core/types';

export const words = loadWordTable();

export function analyzeText(text: string, options?: AnalysisOptions): AnalyzeOutput {
  return analyze({ text, data: words, options });
}
