// An item's running totals over its words: counts, WCM, frequency figures. One place for the sums,
// whichever way the item's words were read (plain words or the general tokens; see analyze.ts).
import { LOW_FREQUENCY_ZIPF } from './frequency';
import { isEstimated, type WordScore } from './pronounce';
import type { WcmParts, WordAnalysis } from './types';
import { addWcmParts, emptyWcmParts } from './wcm';

export class ItemTotals {
  readonly parts: WcmParts = emptyWcmParts();
  syllables = 0;
  phonemes = 0;
  wcm = 0;
  zipfSum = 0;
  zipfMin = Infinity;
  low = 0;
  estimated = 0;
  counted = 0;

  add(s: WordScore): void {
    this.syllables += s.syllables;
    this.phonemes += s.phonemes;
    this.wcm += s.wcm.total;
    addWcmParts(this.parts, s.wcm.parts);
    if (isEstimated(s)) this.estimated++;
    // A word the script spells out itself (an override, typically a name) and that the subtitle
    // corpus never saw says nothing about how familiar it is to the client, so it is left out of
    // the frequency figures; an item of nothing else keeps it (see `frequency`).
    if (s.source === 'override' && s.count === 0) return;
    this.counted++;
    this.zipfSum += s.zipf;
    if (s.zipf < this.zipfMin) this.zipfMin = s.zipf;
    if (s.zipf < LOW_FREQUENCY_ZIPF) this.low++;
  }

  /** Mean and lowest Zipf of the counted words (of all words when none was counted), 0 for none. */
  frequency(words: WordAnalysis[]): { zipfMean: number; zipfMin: number; low: number } {
    let { zipfSum, zipfMin, low, counted } = this;
    if (counted === 0 && words.length > 0) {
      for (const w of words) {
        zipfSum += w.zipf;
        if (w.zipf < zipfMin) zipfMin = w.zipf;
        if (w.zipf < LOW_FREQUENCY_ZIPF) low++;
      }
      counted = words.length;
    }
    return { zipfMean: counted ? zipfSum / counted : 0, zipfMin: counted ? zipfMin : 0, low };
  }
}
