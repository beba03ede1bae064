// JSON text in pieces, so output larger than the biggest string V8 can hold (about 512 MB) is
// written bit by bit instead of crashing. The pieces join to exactly `JSON.stringify(value, null, 2)`.

/** Yields the pieces of `JSON.stringify(value, null, 2)` for plain data (objects, arrays, scalars). */
export function* jsonPieces(value: unknown, indent = ''): Generator<string> {
  if (value !== null && typeof value === 'object' && typeof (value as { toJSON?: unknown }).toJSON === 'function') {
    value = (value as { toJSON(): unknown }).toJSON();
  }
  if (Array.isArray(value)) {
    if (!value.length) {
      yield '[]';
      return;
    }
    const inner = `${indent}  `;
    yield '[';
    for (let i = 0; i < value.length; i++) {
      yield `${i ? ',' : ''}\n${inner}`;
      const v = value[i];
      if (v === undefined || typeof v === 'function' || typeof v === 'symbol') yield 'null';
      else yield* jsonPieces(v, inner);
    }
    yield `\n${indent}]`;
    return;
  }
  if (value !== null && typeof value === 'object') {
    const inner = `${indent}  `;
    let first = true;
    for (const [k, v] of Object.entries(value)) {
      if (v === undefined || typeof v === 'function' || typeof v === 'symbol') continue;
      yield `${first ? '{' : ','}\n${inner}${JSON.stringify(k)}: `;
      first = false;
      yield* jsonPieces(v, inner);
    }
    yield first ? '{}' : `\n${indent}}`;
    return;
  }
  yield JSON.stringify(value) ?? 'null';
}

/** Groups small pieces into writes of about `size` characters (fewer, larger writes). */
export function* batched(pieces: Iterable<string>, size = 1 << 16): Generator<string> {
  let buf: string[] = [];
  let n = 0;
  for (const p of pieces) {
    buf.push(p);
    n += p.length;
    if (n >= size) {
      yield buf.join('');
      buf = [];
      n = 0;
    }
  }
  if (n) yield buf.join('');
}
