// The wait after a keystroke follows what re-checking costs (server/src/lsp/debounce.ts).
// Expected values are computed by hand from its rule: half the smoothed cost (each new cost
// averaged with the previous), at least MIN_DELAY_MS, at most the given maximum.
import { describe, expect, it } from 'vitest';
import { AdaptiveDelay, MIN_DELAY_MS } from '../../server/src/lsp/debounce';

describe('adaptive publish delay', () => {
  it('waits the longest until a re-check has been timed', () => {
    expect(new AdaptiveDelay(150).next()).toBe(150);
  });

  it('follows half the smoothed cost, within its bounds', () => {
    const d = new AdaptiveDelay(150);
    d.record(20); // computed: cost 20 -> wait 10
    expect(d.next()).toBe(10);
    d.record(60); // computed: cost (20 + 60) / 2 = 40 -> wait 20
    expect(d.next()).toBe(20);
    d.record(400); // computed: cost 220 -> wait 110
    expect(d.next()).toBe(110);
    d.record(400); // computed: cost 310 -> wait 155, capped at 150
    expect(d.next()).toBe(150);
    for (let i = 0; i < 20; i++) d.record(0.5); // computed: cost -> 0.5, wait 0.25, raised to the minimum
    expect(d.next()).toBe(MIN_DELAY_MS);
  });

  it('ignores a cost that is not a number of milliseconds', () => {
    const d = new AdaptiveDelay(150);
    d.record(Number.NaN);
    d.record(-1);
    expect(d.next()).toBe(150);
  });
});
