// Bytes to text and back without loss, for `--fix`: a file with invalid UTF-8 in it must come back
// byte for byte outside the fixed spans. Each byte that is not part of a well-formed UTF-8 sequence
// (Unicode 15, table 3-7) becomes one lone low surrogate U+DC80..U+DCFF, which well-formed UTF-8
// never holds, and turns back into that byte on the way out (the "surrogate escape" of PEP 383).
// Pure: no fs. A BOM is kept as U+FEFF, as Buffer#toString keeps it.

const strict = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });

/** Second-byte ranges of each lead byte; later bytes are always 0x80..0xBF. */
function sequence(b0: number): { length: number; lo: number; hi: number } | null {
  if (b0 >= 0xc2 && b0 <= 0xdf) return { length: 2, lo: 0x80, hi: 0xbf };
  if (b0 === 0xe0) return { length: 3, lo: 0xa0, hi: 0xbf };
  if (b0 === 0xed) return { length: 3, lo: 0x80, hi: 0x9f };
  if (b0 >= 0xe1 && b0 <= 0xef) return { length: 3, lo: 0x80, hi: 0xbf };
  if (b0 === 0xf0) return { length: 4, lo: 0x90, hi: 0xbf };
  if (b0 === 0xf4) return { length: 4, lo: 0x80, hi: 0x8f };
  if (b0 >= 0xf1 && b0 <= 0xf3) return { length: 4, lo: 0x80, hi: 0xbf };
  return null;
}

export function decodeLossless(bytes: Uint8Array): string {
  try {
    return strict.decode(bytes);
  } catch {
    // Invalid somewhere: decode by hand below.
  }
  const parts: string[] = [];
  let run: number[] = [];
  const flush = () => {
    if (run.length) parts.push(String.fromCharCode(...run));
    run = [];
  };
  for (let i = 0; i < bytes.length; ) {
    const b0 = bytes[i];
    if (b0 < 0x80) {
      run.push(b0);
      i++;
    } else {
      const s = sequence(b0);
      let ok = s !== null && i + s.length <= bytes.length && bytes[i + 1] >= s.lo && bytes[i + 1] <= s.hi;
      for (let k = 2; ok && s && k < s.length; k++) ok = bytes[i + k] >= 0x80 && bytes[i + k] <= 0xbf;
      if (ok && s) {
        let cp = b0 & (s.length === 2 ? 0x1f : s.length === 3 ? 0x0f : 0x07);
        for (let k = 1; k < s.length; k++) cp = (cp << 6) | (bytes[i + k] & 0x3f);
        if (cp > 0xffff) run.push(0xd800 + ((cp - 0x10000) >> 10), 0xdc00 + ((cp - 0x10000) & 0x3ff));
        else run.push(cp);
        i += s.length;
      } else {
        run.push(0xdc00 + b0);
        i++;
      }
    }
    if (run.length >= 4096) flush();
  }
  flush();
  return parts.join('');
}

/** The inverse of decodeLossless. Lone surrogates it did not make become U+FFFD, as in UTF-8 output. */
export function encodeLossless(text: string): Uint8Array {
  if (!/[\ud800-\udfff]/.test(text)) return new TextEncoder().encode(text);
  const enc = new TextEncoder();
  const chunks: Uint8Array[] = [];
  let from = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d <= 0xdfff) {
        i++;
        continue;
      }
    }
    if (c >= 0xdc80 && c <= 0xdcff) {
      chunks.push(enc.encode(text.slice(from, i)), Uint8Array.of(c - 0xdc00));
      from = i + 1;
    }
  }
  chunks.push(enc.encode(text.slice(from)));
  let n = 0;
  for (const c of chunks) n += c.length;
  const out = new Uint8Array(n);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.length;
  }
  return out;
}
