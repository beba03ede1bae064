// Lint directives: `//` comments that silence rules where a problem is deliberate.
//   // rungs: allow item-outlier, duplicate-item     -> the next line that is not blank or a comment
//   // rungs: allow-file pace-above-norm               -> the whole script
// Unknown ids and verbs are problems of their own (bad-directive), never silently ignored.
import { nearestName } from '../core/nearest';
import type { CommentLine, Problem } from '../core/types';
import { excerpt } from '../core/excerpt';
import type { Report } from './types';

export const DIRECTIVE_PREFIX = 'rungs:';
export const DIRECTIVE_VERBS = ['allow', 'allow-file'] as const;

export interface Directives {
  /** Rule ids silenced in the whole file. */
  file: Set<string>;
  /** Rule ids silenced per 0-based line. */
  lines: Map<number, Set<string>>;
  /** Malformed directives, for the bad-directive rule to report (it adds its id). */
  problems: Parameters<Report>[0][];
}

/** Reads the directives; `ownId` (bad-directive's id) cannot be silenced by one. */
export function readDirectives(comments: CommentLine[], lines: string[], knownIds: readonly string[], ownId: string): Directives {
  const out: Directives = { file: new Set(), lines: new Map(), problems: [] };
  const commentLines = new Set(comments.map((c) => c.line));
  for (const c of comments) {
    const raw = lines[c.line] ?? '';
    const bodyStart = raw.indexOf('//', c.start) + 2;
    const body = raw.slice(bodyStart);
    const m = /^(\s*rungs\s*:\s*)(\S*)(.*)$/i.exec(body);
    if (!m) continue;
    const verbStart = bodyStart + m[1].length;
    const bad = (message: string, from: number, to: number, fix?: Problem['fix']) =>
      out.problems.push({ message, line: c.line, character: from, endLine: c.line, endCharacter: to, fix });
    const verb = m[2].toLowerCase();
    if (!(DIRECTIVE_VERBS as readonly string[]).includes(verb)) {
      bad(`unknown directive "${excerpt(m[2])}": write "// rungs: allow RULE" (next line) or "// rungs: allow-file RULE"`, verbStart, verbStart + Math.max(1, m[2].length));
      continue;
    }
    const ids: string[] = [];
    const re = /[^\s,]+/g;
    let t: RegExpExecArray | null;
    const restStart = verbStart + m[2].length;
    while ((t = re.exec(m[3]))) {
      const id = t[0];
      const from = restStart + t.index;
      if (knownIds.includes(id.toLowerCase())) {
        if (id.toLowerCase() !== ownId) ids.push(id.toLowerCase());
        continue;
      }
      const near = nearestName(id, knownIds);
      bad(
        `unknown rule "${excerpt(id)}" in a directive${near ? `; did you mean "${near}"?` : ''}`,
        from,
        from + id.length,
        near ? { title: `Change "${excerpt(id)}" to "${near}"`, edits: [{ line: c.line, character: from, endLine: c.line, endCharacter: from + id.length, newText: near }] } : undefined,
      );
    }
    if (!/[^\s,]/.test(m[3])) {
      bad(`"// rungs: ${verb}" needs at least one rule id, e.g. "// rungs: ${verb} item-outlier"`, verbStart, verbStart + verb.length);
      continue;
    }
    if (verb === 'allow-file') {
      for (const id of ids) out.file.add(id);
      continue;
    }
    let target = c.line + 1;
    while (target < lines.length && (!lines[target].trim() || commentLines.has(target))) target++;
    const set = out.lines.get(target) ?? new Set<string>();
    for (const id of ids) set.add(id);
    out.lines.set(target, set);
  }
  return out;
}

/** Whether a directive silences a problem. */
export function isAllowed(d: Directives, p: Problem): boolean {
  return d.file.has(p.rule) || Boolean(d.lines.get(p.line)?.has(p.rule));
}
