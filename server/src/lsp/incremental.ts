// Re-analysis of an open document that redoes only what changed: rungs an edit did not touch keep
// their analyses (core/segments.ts), and in the rungs it did, unchanged items come from the item
// cache, so after a one-character edit only the edited item is tokenised and scored again
// (tests/core/incremental.property.test.ts checks the result equals a fresh analysis).
import type { AnalyzeInput, AnalyzeOutput } from '../core/analyze';
import { analyzeSegments, type SegmentState } from '../core/segments';

export type IncrementalState = SegmentState;

export function analyzeIncremental(
  input: AnalyzeInput,
  previous: IncrementalState | undefined,
): { output: AnalyzeOutput; cache: IncrementalState } {
  const state = analyzeSegments(input, previous);
  return { output: state.output, cache: state };
}
