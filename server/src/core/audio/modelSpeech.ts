// Model speech fitted to the timing plan: each word's recording (made by a synthesiser outside the
// core) is trimmed of its silence, stretched to its slot and laid down at the slot's onset, so the
// audio follows the plan rather than the synthesiser's own idea of a rate. A short silence closes
// every slot but the item's last, so each word starts cleanly where the plan puts it. Pure:
// samples in, samples out.
import type { PlannedItem, PlannedWord } from '../timing';
import { detectSegments } from './onsets';
import { stretchTo } from './stretch';

/** The silence left at the end of a word's slot (not the item's last): 15 % of it, 50-120 ms. */
export function slotTail(slotSeconds: number): number {
  return Math.min(0.12, Math.max(0.05, 0.15 * slotSeconds));
}

/** The part of a recording from its first to its last sound (within 45 dB of its loudest frame). */
export function trimSilence(samples: Float32Array, sampleRate: number): Float32Array {
  const segments = detectSegments(samples, sampleRate, { thresholdDb: -45, minSilence: 10, minSound: 0 });
  if (!segments.length) return new Float32Array(0);
  const from = Math.floor(segments[0].onset * sampleRate);
  const to = Math.min(samples.length, Math.ceil(segments[segments.length - 1].offset * sampleRate));
  return samples.slice(from, to);
}

/** Fades the first and last 5 ms, so laid-down words do not click. */
function fade(x: Float32Array, sampleRate: number): void {
  const n = Math.min(Math.round(0.005 * sampleRate), x.length >> 1);
  for (let i = 0; i < n; i++) {
    const g = i / n;
    x[i] *= g;
    x[x.length - 1 - i] *= g;
  }
}

/**
 * Renders `items` between `start` and `end` seconds of the plan. `clipFor` gives a word's trimmed
 * recording (or undefined to leave its slot silent).
 */
export function renderItems(
  items: PlannedItem[],
  clipFor: (word: PlannedWord, item: PlannedItem) => Float32Array | undefined,
  sampleRate: number,
  start: number,
  end: number,
): Float32Array {
  const out = new Float32Array(Math.max(0, Math.round((end - start) * sampleRate)));
  for (const item of items) {
    item.words.forEach((w, k) => {
      const clip = clipFor(w, item);
      if (!clip || !clip.length) return;
      const slot = w.offset - w.onset;
      const length = k < item.words.length - 1 ? slot - slotTail(slot) : slot;
      const fitted = stretchTo(clip, Math.round(length * sampleRate), sampleRate);
      fade(fitted, sampleRate);
      const at = Math.round((w.onset - start) * sampleRate);
      for (let i = 0; i < fitted.length && at + i < out.length; i++) if (at + i >= 0) out[at + i] += fitted[i];
    });
  }
  return out;
}
