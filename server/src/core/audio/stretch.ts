// Time-stretching of speech without changing its pitch: waveform-similarity overlap-add (WSOLA;
// Verhelst & Roelands 1993, ICASSP; from memory). Frames of 30 ms are laid down every 15 ms of
// output; each frame is read from the input near the place the time scale asks for, shifted by up
// to 10 ms to the position that best continues the previous frame, so voiced speech keeps its
// periods and does not sound phasey. Pure: samples in, samples out.

function hann(n: number): Float32Array {
  const w = new Float32Array(n);
  for (let i = 0; i < n; i++) w[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / (n - 1));
  return w;
}

/**
 * Returns `input` stretched (or squeezed) to exactly `outLength` samples. An empty input gives
 * silence; a zero length gives an empty array.
 */
export function stretchTo(input: Float32Array, outLength: number, sampleRate: number): Float32Array {
  const out = new Float32Array(Math.max(0, outLength));
  if (outLength <= 0 || input.length === 0) return out;
  const n = Math.max(16, Math.round(0.03 * sampleRate));
  const hop = n >> 1;
  const tolerance = Math.round(0.01 * sampleRate);
  const w = hann(n);
  const acc = new Float32Array(outLength + n);
  const norm = new Float32Array(outLength + n);
  const scale = input.length / outLength;
  let prev = -1;
  for (let outPos = 0; outPos < outLength; outPos += hop) {
    let inPos = Math.round(outPos * scale);
    if (prev >= 0) {
      // The best shift makes the new frame most like the natural continuation of the last one.
      const natural = prev + hop;
      let best = 0;
      let bestScore = -Infinity;
      for (let d = -tolerance; d <= tolerance; d += 2) {
        const p = inPos + d;
        if (p < 0 || p + n > input.length || natural + n > input.length) continue;
        let score = 0;
        for (let i = 0; i < n; i += 4) score += input[p + i] * input[natural + i];
        if (score > bestScore) {
          bestScore = score;
          best = d;
        }
      }
      inPos += best;
    }
    inPos = Math.min(Math.max(0, inPos), Math.max(0, input.length - 1));
    for (let i = 0; i < n && outPos + i < acc.length; i++) {
      const x = inPos + i < input.length ? input[inPos + i] : 0;
      acc[outPos + i] += x * w[i];
      norm[outPos + i] += w[i];
    }
    prev = inPos;
  }
  for (let i = 0; i < outLength; i++) out[i] = norm[i] > 1e-3 ? acc[i] / norm[i] : acc[i];
  return out;
}
