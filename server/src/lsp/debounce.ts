// How long the server waits after a keystroke before it re-checks and publishes. A fixed wait
// long enough for a slow re-check makes every edit of a small script slow too; no wait at all
// lets a slow re-check run back to back while the person keeps typing. So the wait follows what
// re-checking costs: the server stays idle for at least half a recent re-check between two
// re-checks, which keeps it re-checking at most two thirds of the time while someone types
// without pause. Time already spent idle since the last re-check counts: a keystroke after a
// pause is checked at once (after the shortest wait), and only a keystroke that follows the last
// publish closely waits out the rest. Handlers run one at a time, so keystrokes that arrive
// during a re-check wait in the input and all land before the next one: a typing burst never
// builds a queue of re-checks.

/**
 * The shortest wait: the protocol library handles queued messages one per turn of the event
 * loop, and a millisecond is enough for the keystrokes of one write to land before the re-check
 * (one that lands after it only costs another re-check; the result is always of the last text).
 */
export const MIN_DELAY_MS = 1;

/** The idle time between two re-checks as a share of the smoothed cost of one. */
export const COST_SHARE = 0.5;

export class AdaptiveDelay {
  /** A smoothed recent cost (exponential moving average), in milliseconds. */
  private cost: number | null = null;
  /** When the last timed re-check ended (a clock in milliseconds, as `performance.now()`). */
  private lastEnd = Number.NEGATIVE_INFINITY;

  constructor(private readonly max: number) {}

  /** Records what one re-check and publish took, and when it ended. */
  record(ms: number, endedAt: number = performance.now()): void {
    if (!(ms >= 0)) return;
    // A new cost counts for half, so a one-off slow run (the first, a cold cache) fades quickly.
    this.cost = this.cost === null ? ms : (this.cost + ms) / 2;
    if (endedAt > this.lastEnd) this.lastEnd = endedAt;
  }

  /**
   * The wait before the next re-check, for a keystroke at `now`: what is left of half the
   * smoothed cost since the last re-check ended. Before any re-check has been timed there is
   * nothing to keep apart from, so the shortest.
   */
  next(now: number = performance.now()): number {
    if (this.cost === null) return MIN_DELAY_MS;
    const idle = Math.min(this.max, this.cost * COST_SHARE);
    const rest = idle - Math.max(0, now - this.lastEnd);
    return Math.round(Math.min(this.max, Math.max(MIN_DELAY_MS, rest)));
  }
}
