// How long the server waits after a keystroke before it re-checks and publishes. A fixed wait
// long enough for a slow re-check makes every edit of a small script slow too; no wait at all
// lets a slow re-check run once per keystroke while the person keeps typing. So the wait follows
// what re-checking costs: half a recent re-check, between a few milliseconds and the most it may
// be, so that while someone types without pause the server spends at most two thirds of the time
// re-checking, and a person waits one and a half re-checks for the result, not two. Handlers run
// one at a time, so keystrokes that arrive during a re-check wait in the input and all land
// before the next one: a typing burst never builds a queue of re-checks.

/** The shortest wait: keystrokes sent in one write still land together. */
export const MIN_DELAY_MS = 4;

/** The wait as a share of the smoothed cost of a re-check. */
export const COST_SHARE = 0.5;

export class AdaptiveDelay {
  /** A smoothed recent cost (exponential moving average), in milliseconds. */
  private cost: number | null = null;

  constructor(private readonly max: number) {}

  /** Records what one re-check and publish took. */
  record(ms: number): void {
    if (!(ms >= 0)) return;
    // A new cost counts for half, so a one-off slow run (the first, a cold cache) fades quickly.
    this.cost = this.cost === null ? ms : (this.cost + ms) / 2;
  }

  /** The wait before the next re-check: half the smoothed cost. Until a cost is known, the longest. */
  next(): number {
    if (this.cost === null) return this.max;
    return Math.round(Math.min(this.max, Math.max(MIN_DELAY_MS, this.cost * COST_SHARE)));
  }
}
