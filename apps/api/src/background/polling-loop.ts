/** What a round of a polling loop reports: `'busy'` goes again at once, `'idle'` waits `pollMs`. */
export type RoundOutcome = 'busy' | 'idle';

/**
 * A background loop that runs one round at a time on a timer: after a busy round it goes again at
 * once, after an idle or failed round it waits `pollMs`. A failed round is logged and the loop
 * goes on. `stop()` cancels the next round and waits for the one in progress.
 */
export class PollingLoop {
  private timer: NodeJS.Timeout | null = null;
  private current: Promise<void> | null = null;
  private stopped = true;
  /** a wake() came while a round was running: go again as soon as it ends */
  private woken = false;

  constructor(
    private readonly round: () => Promise<RoundOutcome>,
    private readonly pollMs: number,
    /** start of the log line for a failed round, e.g. "outbox: a send round failed" */
    private readonly failureLog: string,
  ) {}

  start(): void {
    if (!this.stopped) return;
    this.stopped = false;
    this.schedule(0);
  }

  /** Runs the next round now instead of after the wait (e.g. work was just queued in this process). */
  wake(): void {
    if (this.stopped) return;
    if (this.current) {
      this.woken = true;
      return;
    }
    if (this.timer) clearTimeout(this.timer);
    this.schedule(0);
  }

  async stop(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    await this.current;
  }

  private schedule(delay: number): void {
    if (this.stopped) return;
    this.timer = setTimeout(() => {
      this.current = this.round()
        .catch((err: unknown): RoundOutcome => {
          console.error(`${this.failureLog}:`, err instanceof Error ? err.message : err);
          return 'idle';
        })
        .then((outcome) => {
          this.current = null;
          const again = outcome === 'busy' || this.woken;
          this.woken = false;
          this.schedule(again ? 0 : this.pollMs);
        });
    }, delay);
  }
}
