// A binary image of parsed pronunciation models: the typed arrays of each model (model.ts) laid
// out as they sit in memory, so a process reads the estimator by reading one file and taking views
// of it, where reading the committed text model costs a brotli decompression and a parse (about
// 0.3 s of CPU, measured). The build writes the image from the committed model
// (server/scripts/build.mjs); the loader (data/pronounceModel.ts) takes the image when it reads
// and checks, and the text model otherwise. Pure: bytes in, models out.
//
// Layout, every number little-endian:
//   0   "RUNGSG2P" (8 bytes)
//   8   u32 image version (IMAGE_VERSION)
//   12  u32 byte length L of the JSON that follows
//   16  JSON { source, check, models: [header, ...] } (UTF-8), padded with spaces to a multiple of 8
//   ... per model, each array padded to a multiple of 8 bytes: tok (u16 x n), logp (i16 x n),
//       bow (i16 x n), backoff (i32 x n), next (i32 x n), firstChild (i32 x n + 1), where n is
//       the header's `entries`.
// `check` is a 32-bit hash of everything after the JSON (8 hex digits), so a changed byte anywhere
// in the arrays is found on reading; and every index in the arrays is checked, so a damaged image
// is refused, never decoded.
import { checkHeader, readGraphones, type G2pModel, type ModelHeader } from './model';

const MAGIC = 'RUNGSG2P';
export const IMAGE_VERSION = 1;

export interface ModelImage {
  /** What the image was made from (the build records a digest of the committed model file). */
  source: string;
  models: G2pModel[];
}

const pad8 = (n: number): number => (n + 7) & ~7;

type ArrayName = 'tok' | 'logp' | 'bow' | 'backoff' | 'next' | 'firstChild';
type Typed = Uint16Array | Int16Array | Int32Array;
/** Each array of a model in file order, its type, and how many more entries than n it has. */
const ARRAYS: { name: ArrayName; type: { new (buffer: ArrayBufferLike, offset: number, length: number): Typed; BYTES_PER_ELEMENT: number }; extra: number }[] = [
  { name: 'tok', type: Uint16Array, extra: 0 },
  { name: 'logp', type: Int16Array, extra: 0 },
  { name: 'bow', type: Int16Array, extra: 0 },
  { name: 'backoff', type: Int32Array, extra: 0 },
  { name: 'next', type: Int32Array, extra: 0 },
  { name: 'firstChild', type: Int32Array, extra: 1 },
];
const arrayBytes = (a: (typeof ARRAYS)[number], n: number): number => a.type.BYTES_PER_ELEMENT * (n + a.extra);

const littleEndian = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/**
 * A hash of 32-bit words (FNV-1a's step on whole words): each step is a bijection of the state, so
 * changing any one word changes the result.
 */
function wordsHash(bytes: Uint8Array): string {
  const words = new Int32Array(bytes.buffer, bytes.byteOffset, bytes.byteLength >> 2);
  let h = 0x811c9dc5;
  for (let i = 0; i < words.length; i++) h = Math.imul(h ^ words[i], 0x01000193);
  return (h >>> 0).toString(16).padStart(8, '0');
}

const headerJson = (source: string, check: string, models: readonly G2pModel[]) => new TextEncoder().encode(JSON.stringify({ source, check, models: models.map((m) => m.header) }));

/** The image of `models`, recording `source` (what they were read from). */
export function writeModelImage(models: readonly G2pModel[], source: string): Uint8Array {
  if (!littleEndian) throw new Error('model images are written on little-endian machines only');
  // The check has a fixed width, so the header's length is known before the arrays are hashed.
  const json = headerJson(source, '00000000', models);
  const head = pad8(16 + json.length);
  let size = head;
  for (const m of models) for (const a of ARRAYS) size += pad8(arrayBytes(a, m.tok.length));
  const out = new Uint8Array(size);
  let at = head;
  for (const m of models) {
    if (m.header.entries !== m.tok.length) throw new Error('model header entries differ from its arrays');
    for (const a of ARRAYS) {
      const arr = m[a.name];
      out.set(new Uint8Array(arr.buffer, arr.byteOffset, arr.byteLength), at);
      at += pad8(arr.byteLength);
    }
  }
  out.set(new TextEncoder().encode(MAGIC), 0);
  const view = new DataView(out.buffer);
  view.setUint32(8, IMAGE_VERSION, true);
  view.setUint32(12, json.length, true);
  out.set(headerJson(source, wordsHash(out.subarray(head)), models), 16);
  out.fill(0x20, 16 + json.length, head);
  return out;
}

/** Reads an image (throws with the reason when it is not one, or is damaged). */
export function readModelImage(input: Uint8Array): ModelImage {
  if (!littleEndian) throw new Error('model images are read on little-endian machines only');
  // Views need their arrays aligned: a buffer that does not start on 8 bytes is copied once.
  const bytes = input.byteOffset % 8 === 0 ? input : input.slice();
  if (bytes.length < 16 || new TextDecoder().decode(bytes.subarray(0, 8)) !== MAGIC) throw new Error('not a pronunciation model image');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const version = view.getUint32(8, true);
  if (version !== IMAGE_VERSION) throw new Error(`pronunciation model image version ${version} is not supported (this build reads ${IMAGE_VERSION})`);
  const jsonLength = view.getUint32(12, true);
  if (16 + jsonLength > bytes.length) throw new Error('pronunciation model image is cut short (header)');
  let meta: { source?: unknown; check?: unknown; models?: unknown };
  try {
    meta = JSON.parse(new TextDecoder().decode(bytes.subarray(16, 16 + jsonLength))) as typeof meta;
  } catch {
    throw new Error('pronunciation model image header is not JSON');
  }
  if (typeof meta !== 'object' || meta === null || typeof meta.source !== 'string' || !Array.isArray(meta.models)) {
    throw new Error('pronunciation model image header lacks source or models');
  }
  let at = pad8(16 + jsonLength);
  if (at > bytes.length || meta.check !== wordsHash(bytes.subarray(at))) throw new Error('pronunciation model image is damaged (its check does not match)');
  const models = (meta.models as ModelHeader[]).map((h) => {
    const header = checkHeader(h);
    const n = header.entries;
    if (!(Number.isInteger(n) && n >= 0)) throw new Error('pronunciation model image: entries is not a count');
    const arrays = {} as Record<ArrayName, Typed>;
    for (const a of ARRAYS) {
      const size = arrayBytes(a, n);
      if (at + size > bytes.length) throw new Error(`pronunciation model image is cut short (${header.direction} ${a.name})`);
      arrays[a.name] = new a.type(bytes.buffer, bytes.byteOffset + at, n + a.extra);
      at += pad8(size);
    }
    const { graphones, byLetters, maxLetters } = readGraphones(header);
    const m: G2pModel = {
      header,
      graphones,
      byLetters,
      tokens: graphones.length,
      maxLetters,
      scale: header.scale,
      tok: arrays.tok as Uint16Array,
      logp: arrays.logp as Int16Array,
      bow: arrays.bow as Int16Array,
      backoff: arrays.backoff as Int32Array,
      next: arrays.next as Int32Array,
      firstChild: arrays.firstChild as Int32Array,
      start: 0,
    };
    checkArrays(m);
    return m;
  });
  if (at !== bytes.length) throw new Error(`pronunciation model image has ${bytes.length - at} bytes past its last model`);
  return { source: meta.source, models };
}

/**
 * What the decoder relies on, checked for every entry: tokens within the graphone list, each
 * backoff entry earlier than its entry (so a backoff chain ends), states within the entries, and
 * successor runs that rise within the entries. A text model meets these by construction.
 */
function checkArrays(m: G2pModel): void {
  const n = m.tok.length;
  const { tok, backoff, next, firstChild, tokens } = m;
  const bad = (what: string, i: number): Error => new Error(`pronunciation model image (${m.header.direction}): ${what} at entry ${i}`);
  if (n < tokens) throw bad('fewer entries than graphones', n);
  for (let i = 0; i < n; i++) {
    if (tok[i] >= tokens) throw bad('token out of range', i);
    if (i < tokens ? tok[i] !== i || backoff[i] !== -1 : backoff[i] < 0 || backoff[i] >= i) throw bad('backoff out of order', i);
    if (next[i] < -1 || next[i] > i) throw bad('state out of range', i);
  }
  if (firstChild[0] < 0 || firstChild[n] !== n) throw bad('successor runs out of range', 0);
  for (let i = 0; i < n; i++) if (firstChild[i + 1] < firstChild[i]) throw bad('successor runs out of order', i);
}
