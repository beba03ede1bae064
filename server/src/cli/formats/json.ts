// JSON for tools: one object per file, lines and columns 1-based (as in `rungs score --format json`).
import type { Problem, Range } from '../../core/types';
import { counts, type LintRun } from './types';

function pos(r: Range) {
  return { line: r.line + 1, column: r.character + 1, endLine: r.endLine + 1, endColumn: r.endCharacter + 1 };
}

export function problemJson(p: Problem): unknown {
  return {
    ...pos(p),
    severity: p.severity,
    rule: p.rule,
    message: p.message,
    ...(p.related?.length ? { related: p.related.map((r) => ({ ...pos(r), message: r.message })) } : {}),
    // `batch: false` tells a tool the fix is for a person to choose, never to apply in bulk.
    ...(p.fix
      ? { fix: { title: p.fix.title, edits: p.fix.edits.map((e) => ({ ...pos(e), newText: e.newText })), ...(p.fix.batch === false ? { batch: false } : {}) } }
      : {}),
  };
}

export function formatLintJson(run: LintRun): string {
  const out = run.results.map((r) => {
    const c = counts(r.problems);
    return { file: r.file, errorCount: c.error, warningCount: c.warning, problems: r.problems.map(problemJson) };
  });
  return `${JSON.stringify(out, null, 2)}\n`;
}
