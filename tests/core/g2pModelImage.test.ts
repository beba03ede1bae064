// The binary image of the pronunciation models (core/g2p/modelImage.ts) and the loader that
// prefers it (data/pronounceModel.ts). The image must give back exactly the arrays the text model
// parses to (checked on the committed model, entry by entry), refuse damage with the reason
// instead of decoding it, and give way to the text model when it is stale or damaged.
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { decode } from '../../server/src/core/g2p/decode';
import { parseModels, type G2pModel } from '../../server/src/core/g2p/model';
import { IMAGE_VERSION, readModelImage, writeModelImage } from '../../server/src/core/g2p/modelImage';
import { IMAGE_FILE, MODEL_FILE, readModelFile, readModels, sourceDigest, writeImageBeside } from '../../server/src/data/pronounceModel';
import { MODEL_PATH } from '../../server/scripts/g2p/model-file.mjs';

// The hand-checked bigram model of tests/core/g2pModel.test.ts (its numbers are explained there).
const header = (over: Record<string, unknown> = {}) =>
  JSON.stringify({ format: 2, method: 'test', direction: 'forward', scale: 500, params: {}, checksum: '', graphones: ['a}AH0', 'a}EY1', 'b}B'], entries: 7, ...over });
const LINES = ['0 0 -500 -50', '0 1 -250 -100', '0 2 -350', '0 3 -300', '1 1 -150', '0 3 -100', '1 3 -50'];
const text = (h = header()) => new TextEncoder().encode(`${h}\n${LINES.join('\n')}\n`);
const small = parseModels(new Uint8Array([...text(), ...text(header({ direction: 'reverse' }))]));

const ARRAYS = ['tok', 'logp', 'bow', 'backoff', 'next', 'firstChild'] as const;
function expectSameModel(got: G2pModel, want: G2pModel): void {
  expect(got.header).toEqual(want.header);
  expect(got.start).toBe(want.start);
  expect(got.tokens).toBe(want.tokens);
  expect(got.graphones).toEqual(want.graphones);
  for (const a of ARRAYS) {
    expect(got[a].constructor).toBe(want[a].constructor);
    // Compared as bytes: one mismatch anywhere in 700,000 entries fails with its position.
    expect(Buffer.compare(Buffer.from(got[a].buffer, got[a].byteOffset, got[a].byteLength), Buffer.from(want[a].buffer, want[a].byteOffset, want[a].byteLength))).toBe(0);
  }
}

describe('the model image', () => {
  it('gives back the parsed models and the source it records', () => {
    const image = readModelImage(writeModelImage(small, 'from the test'));
    expect(image.source).toBe('from the test');
    expect(image.models).toHaveLength(2);
    image.models.forEach((m, i) => expectSameModel(m, small[i]));
    // The hand-computed search of g2pModel.test.ts: AH0 B at log10 -1.4.
    expect(decode(image.models[0], 'ab', 5, 16).map((c) => [c.phones, c.log10])).toEqual([[['AH0', 'B'], -1.4]]);
  });

  it('is read from a buffer that does not start on an 8-byte boundary', () => {
    const bytes = writeModelImage(small, 's');
    const shifted = new Uint8Array(bytes.length + 3);
    shifted.set(bytes, 3);
    expectSameModel(readModelImage(shifted.subarray(3)).models[0], small[0]);
  });

  describe('refuses damage with the reason', () => {
    const good = () => writeModelImage(small.slice(0, 1), 's');
    const damaged = (f: (b: Uint8Array, v: DataView) => void) => {
      const b = good();
      f(b, new DataView(b.buffer));
      return () => readModelImage(b);
    };
    const arraysAt = (b: Uint8Array) => (16 + new DataView(b.buffer).getUint32(12, true) + 7) & ~7;
    it('not an image, another version, a header that is not JSON', () => {
      expect(() => readModelImage(text())).toThrow(/not a pronunciation model image/);
      expect(damaged((_, v) => v.setUint32(8, IMAGE_VERSION + 1, true))).toThrow(`version ${IMAGE_VERSION + 1} is not supported`);
      expect(damaged((b) => (b[17] = 0x7b))).toThrow(/header is not JSON/);
    });
    it('any changed, missing or added byte after the header (its check)', () => {
      const check = /damaged \(its check does not match\)/;
      // One bit of one log probability: every index stays valid, only the check can tell.
      expect(damaged((b) => (b[arraysAt(b) + 7 * 2 + 1] ^= 1))).toThrow(check);
      expect(() => readModelImage(good().subarray(0, good().length - 8))).toThrow(check);
      expect(() => readModelImage(new Uint8Array([...good(), 0, 0, 0, 0, 0, 0, 0, 0]))).toThrow(check);
    });
    it('an index the decoder would follow out of the model, even with a matching check', () => {
      // Written whole by writeModelImage (so the check matches) from a model with one bad entry:
      // entry 4 (<s> a}AH0) with its token past the graphones, its backoff pointing at itself (a
      // chain that never ends), its state past the entries; successor runs that fall back.
      const bad = (f: (m: G2pModel) => void) => {
        const m = { ...small[0], ...Object.fromEntries(ARRAYS.map((a) => [a, small[0][a].slice()])) } as G2pModel;
        f(m);
        return () => readModelImage(writeModelImage([m], 's'));
      };
      expect(bad((m) => (m.tok[4] = 9))).toThrow(/token out of range at entry 4/);
      expect(bad((m) => (m.backoff[4] = 4))).toThrow(/backoff out of order at entry 4/);
      expect(bad((m) => (m.next[4] = 7))).toThrow(/state out of range at entry 4/);
      expect(bad((m) => (m.firstChild[2] = 0))).toThrow(/successor runs out of order at entry 1/);
    });
  });
});

describe('loading the estimator', () => {
  const committed = readFileSync(MODEL_PATH);
  const fromText = readModelFile(committed);
  const made: string[] = [];
  const scratch = () => (made.push(mkdtempSync(join(tmpdir(), 'rungs-model-image-'))), made[made.length - 1]);
  afterAll(() => made.forEach((d) => rmSync(d, { recursive: true, force: true })));
  const dir = scratch();
  copyFileSync(MODEL_PATH, join(dir, MODEL_FILE));

  it('writes the image of the committed model once, with the same arrays as its text', () => {
    const writes: string[] = [];
    const write = (p: string, b: Uint8Array) => (writes.push(p), writeFileSync(p, b));
    expect(writeImageBeside(dir, write)).toBe('written');
    expect(writeImageBeside(dir, write)).toBe('current');
    expect(writes).toEqual([join(dir, IMAGE_FILE)]);
    const image = readModelImage(readFileSync(join(dir, IMAGE_FILE)));
    expect(image.source).toBe(sourceDigest(committed));
    image.models.forEach((m, i) => expectSameModel(m, fromText[i]));
    // The loader takes the image: the same estimates as the text model for unlisted spellings.
    const loaded = readModels(dir);
    for (const w of ['wintermoss', 'okafor', 'brisbolt']) expect(decode(loaded[0], w, 5, 16)).toEqual(decode(fromText[0], w, 5, 16));
  });

  it('falls back to the text model when the image is stale or damaged, and says why when neither reads', () => {
    const other = scratch();
    copyFileSync(MODEL_PATH, join(other, MODEL_FILE));
    writeFileSync(join(other, IMAGE_FILE), writeModelImage(small, 'sha256:another model'));
    // A stale image (the small model) is passed over: the committed model's two directions load.
    expect(readModels(other).map((m) => m.tokens)).toEqual(fromText.map((m) => m.tokens));
    writeFileSync(join(other, IMAGE_FILE), new Uint8Array(40));
    expect(readModels(other).map((m) => m.tokens)).toEqual(fromText.map((m) => m.tokens));
    writeFileSync(join(other, MODEL_FILE), 'not brotli');
    expect(() => readModels(other)).toThrow(new RegExp(`${MODEL_FILE}: .*; .*${IMAGE_FILE}: not a pronunciation model image`));
    // Only an image, as made by the build: read without a model file to compare it with.
    const alone = scratch();
    writeFileSync(join(alone, IMAGE_FILE), writeModelImage(small, 'sha256:any'));
    expect(readModels(alone)).toHaveLength(2);
    expect(() => readModels(scratch())).toThrow(/not found: run `npm run build`/);
  });
});
