// The steps of a ladder (neighbouring rungs with items) and the ladder rule, if any, that reports
// each one. Shared by the editor's ladder view (lsp/ladder.ts) and the printed report, so both
// mark the same steps. Pure: analysis and lint results in, plain data out.
import type { Analysis, Problem, RungAnalysis } from '../core/types';
import type { LadderStep } from '../lsp/contract';
import { STEP_RULES } from '../rules/index';

const round1 = (n: number) => Math.round(n * 10) / 10;

/** `medianOf` gives each rung's median on the ladder metric (composite difficulty by default). */
export function ladderSteps(a: Analysis, problems: Problem[], medianOf: (r: RungAnalysis) => number = (r) => r.median): LadderStep[] {
  const steps: LadderStep[] = [];
  const withItems = a.rungs.filter((r) => r.items.length > 0);
  for (let i = 1; i < withItems.length; i++) {
    const from = withItems[i - 1];
    const to = withItems[i];
    // A step problem sits on the later rung (its header or within it), or
    // points at the earlier rung through its related information.
    const end = a.rungs[to.index + 1]?.node.line ?? Infinity;
    const p = problems.find(
      (x) =>
        STEP_RULES.includes(x.rule) &&
        x.line >= to.node.line &&
        x.line < end &&
        (x.line === to.node.line || x.related?.some((r) => r.line === from.node.line)),
    );
    steps.push({ from: from.index, to: to.index, delta: round1(medianOf(to) - medianOf(from)), problem: p?.rule ?? null });
  }
  return steps;
}
