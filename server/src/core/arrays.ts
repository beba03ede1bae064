// Array helpers safe for any length. `a.push(...b)` and `Math.min(...b)` pass every element as a
// call argument, and V8 overflows the stack somewhere past ~100,000 of them: a rung of 130,000
// items or a `@paces` line of 200,000 numbers would crash the analysis. These loop instead.

/** Appends every element of `source` to `target` (in place) and returns `target`. */
export function pushAll<T>(target: T[], source: readonly T[]): T[] {
  for (let i = 0; i < source.length; i++) target.push(source[i]);
  return target;
}

/** Smallest value, or `empty` when there is none. */
export function minOf(values: readonly number[], empty = Infinity): number {
  let m = values.length ? Infinity : empty;
  for (const v of values) if (v < m) m = v;
  return m;
}

/** Largest value, or `empty` when there is none. */
export function maxOf(values: readonly number[], empty = -Infinity): number {
  let m = values.length ? -Infinity : empty;
  for (const v of values) if (v > m) m = v;
  return m;
}
