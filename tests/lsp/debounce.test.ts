// The wait after a keystroke follows what re-checking costs (server/src/lsp/debounce.ts).
// Expected values are computed by hand from its rule: half the smoothed cost (each new cost
// averaged with the previous), less the time already idle since the last re-check ended, at
// least MIN_DELAY_MS, at most the given maximum. Clock values are passed in, so nothing here
// depends on how fast the test runs.
import { describe, expect, it } from 'vitest';
import { AdaptiveDelay, MIN_DELAY_MS } from '../../server/src/lsp/debounce';

describe('adaptive publish delay', () => {
  it('waits the shortest until a re-check has been timed', () => {
    expect(new AdaptiveDelay(150).next(0)).toBe(MIN_DELAY_MS);
  });

  it('follows half the smoothed cost, within its bounds, for a keystroke right after a re-check', () => {
    const d = new AdaptiveDelay(150);
    d.record(20, 1000); // computed: cost 20 -> wait 10
    expect(d.next(1000)).toBe(10);
    d.record(60, 2000); // computed: cost (20 + 60) / 2 = 40 -> wait 20
    expect(d.next(2000)).toBe(20);
    d.record(400, 3000); // computed: cost 220 -> wait 110
    expect(d.next(3000)).toBe(110);
    d.record(400, 4000); // computed: cost 310 -> wait 155, capped at 150
    expect(d.next(4000)).toBe(150);
    for (let i = 0; i < 20; i++) d.record(0.5, 5000 + i); // computed: cost -> 0.5, wait 0.25, raised to the minimum
    expect(d.next(5019)).toBe(MIN_DELAY_MS);
  });

  it('counts the time already idle since the last re-check', () => {
    const d = new AdaptiveDelay(150);
    d.record(40, 1000); // computed: cost 40 -> idle 20 ms between re-checks
    expect(d.next(1005)).toBe(15); // computed: 20 - 5
    expect(d.next(1019.6)).toBe(MIN_DELAY_MS); // computed: 20 - 19.6 = 0.4, raised to the minimum
    expect(d.next(1500)).toBe(MIN_DELAY_MS); // after a pause: at once
    // A keystroke during the wait does not push the re-check back: the next one still starts
    // 20 ms after the last ended (1000 + 20 = 1012 + 8).
    expect(d.next(1012)).toBe(8);
  });

  it('keeps a re-check from running more than two thirds of the time under non-stop typing', () => {
    // Keystrokes every 2 ms for 2 s against a re-check that costs 30 ms: simulated by hand from
    // the rule (each keystroke reschedules; a re-check runs when its timer is due).
    const d = new AdaptiveDelay(150);
    const cost = 30;
    let busy = 0;
    let t = 0;
    let due = Number.POSITIVE_INFINITY;
    d.record(cost, -1000);
    while (t < 2000) {
      if (due <= t) {
        busy += cost;
        t = due + cost;
        d.record(cost, t);
        due = Number.POSITIVE_INFINITY;
        continue;
      }
      due = t + d.next(t);
      t += 2;
    }
    expect(busy / t).toBeLessThanOrEqual(2 / 3 + 0.02); // computed: 30 / (30 + 15) = 2/3
    expect(busy / t).toBeGreaterThan(0.5);
  });

  it('ignores a cost that is not a number of milliseconds', () => {
    const d = new AdaptiveDelay(150);
    d.record(Number.NaN, 0);
    d.record(-1, 0);
    expect(d.next(0)).toBe(MIN_DELAY_MS);
    d.record(300, 0); // computed: cost 300 -> wait 150, the most
    expect(d.next(0)).toBe(150);
  });
});
