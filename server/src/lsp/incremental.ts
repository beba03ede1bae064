// Re-analysis of an open document that re-scores only what changed: the core's item cache from
// the previous run goes back in, so after a one-character edit only the edited item is tokenised
// and scored again (tests/lsp/incremental.test.ts checks the result equals a fresh analysis).
import { analyze, type AnalyzeInput, type AnalyzeOutput, type ItemCache } from '../core/analyze';

export type { ItemCache };

export function analyzeIncremental(
  input: AnalyzeInput,
  previous: ItemCache | undefined,
): { output: AnalyzeOutput; cache: ItemCache } {
  const output = analyze({ ...input, itemCache: previous });
  return { output, cache: output.itemCache };
}
