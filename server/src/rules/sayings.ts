// Problems by what they say, so that lint can hand on the problem object it made before when a
// check finds the same thing again (server/src/rules/index.ts). The language server converts and
// writes each problem object once, so reusing them is what keeps a publish after an edit cheap.
// A table holds each problem under a number worked out from its JSON (FNV-1a) and a lookup
// confirms on the JSON itself: keeping the JSON text of every problem would cost megabytes on a
// 10,000-item script.
import type { Problem } from '../core/types';

/** FNV-1a over the UTF-16 code units of a string (offset basis 2166136261, prime 16777619). */
function fnv(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193);
  return h >>> 0;
}

/**
 * Whether a problem's fix works its edits out only when asked (unsorted-rung sorts the rung then):
 * writing such a problem out to compare it would do that work on every check, so it is not kept.
 */
export function lazyFix(p: Problem): boolean {
  return p.fix !== undefined && Object.getOwnPropertyDescriptor(p.fix, 'edits')?.get !== undefined;
}

export class Sayings {
  private readonly byNumber = new Map<number, Problem | Problem[]>();
  private count = 0;

  get size(): number {
    return this.count;
  }

  /** The problem kept with exactly this JSON, if any. */
  find(json: string): Problem | undefined {
    const at = this.byNumber.get(fnv(json));
    if (at === undefined) return undefined;
    if (!Array.isArray(at)) return JSON.stringify(at) === json ? at : undefined;
    return at.find((p) => JSON.stringify(p) === json);
  }

  /** Keeps `p` under its JSON `json` (the caller found none kept). */
  add(json: string, p: Problem): void {
    const h = fnv(json);
    const at = this.byNumber.get(h);
    if (at === undefined) this.byNumber.set(h, p);
    else if (Array.isArray(at)) at.push(p);
    else this.byNumber.set(h, [at, p]);
    this.count++;
  }
}
