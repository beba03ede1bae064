// Array helpers safe for any length. `a.push(...b)` and `Math.min(...b)` pass every element as a
// call argument, and V8 overflows the stack somewhere past ~100,000 of them: a rung of 130,000
// items or a `@paces` line of 200,000 numbers would crash the analysis. These loop instead.

/** Appends every element of `source` to `target` (in place) and returns `target`. */
export function pushAll<T>(target: T[], source: readonly T[]): T[] {
  for (let i = 0; i < source.length; i++) target.push(source[i]);
  return target;
}

/** Lists passed to one `concat` call: well below where a call's arguments overflow the stack. */
const CONCAT_CHUNK = 4096;

/**
 * The lists one after another in a new array, allocated once at its full length (pushing grows
 * the array step by step, copying it each time): an edit of a 10,000-item script joins its rungs'
 * item lists this way. Any number of lists: past CONCAT_CHUNK they are joined in chunks, then
 * the chunks.
 */
export function concatAll<T>(lists: readonly (readonly T[])[]): T[] {
  if (lists.length <= CONCAT_CHUNK) return ([] as T[]).concat(...(lists as T[][]));
  const chunks: T[][] = [];
  for (let i = 0; i < lists.length; i += CONCAT_CHUNK) chunks.push(([] as T[]).concat(...(lists.slice(i, i + CONCAT_CHUNK) as T[][])));
  return concatAll(chunks);
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
