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

/**
 * Whether two values write the same JSON, compared without writing either out: the same
 * primitives, arrays of the same values, and objects with the same keys in the same order holding
 * the same values (a key holding undefined is left out, as JSON leaves it out).
 */
export function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== 'object' || typeof b !== 'object' || a === null || b === null) return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a)) {
    const y = b as unknown[];
    if (a.length !== y.length) return false;
    for (let i = 0; i < a.length; i++) if (!sameJson(a[i] ?? null, y[i] ?? null)) return false;
    return true;
  }
  const x = a as Record<string, unknown>;
  const y = b as Record<string, unknown>;
  const xs = Object.keys(x).filter((k) => x[k] !== undefined);
  const ys = Object.keys(y).filter((k) => y[k] !== undefined);
  if (xs.length !== ys.length) return false;
  for (let i = 0; i < xs.length; i++) if (xs[i] !== ys[i] || !sameJson(x[xs[i]], y[ys[i]])) return false;
  return true;
}

export class Sayings {
  private readonly byNumber = new Map<number, Problem | Problem[]>();
  private count = 0;

  get size(): number {
    return this.count;
  }

  /** The problem kept that says what `p` says (whose JSON is `json`), if any. */
  find(json: string, p: Problem): Problem | undefined {
    const at = this.byNumber.get(fnv(json));
    if (at === undefined) return undefined;
    if (!Array.isArray(at)) return sameJson(at, p) ? at : undefined;
    return at.find((q) => sameJson(q, p));
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
