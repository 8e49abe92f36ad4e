import type { DataSource } from 'typeorm';
import type { Mailer } from '../app-context';
import { PollingLoop } from '../background/polling-loop';
import { leaseDueMail, markMailAttemptFailed, markMailSent } from './outbox.repository';

export interface OutboxSenderSettings {
  /** how often the loop looks for due mail (ms); default 2 000 */
  pollMs: number;
  /** delay before the first retry (ms); doubles each attempt; default 5 000 */
  backoffBaseMs: number;
  /** longest delay between attempts (ms); default 30 minutes */
  backoffMaxMs: number;
  /** attempts before a message is marked failed; default 10 */
  maxAttempts: number;
  /** messages per round; default 20 */
  batchSize: number;
  /** how long a leased message is reserved for this sender (ms); default 60 000 */
  leaseMs: number;
}

export const defaultOutboxSenderSettings: OutboxSenderSettings = {
  pollMs: 2_000,
  backoffBaseMs: 5_000,
  backoffMaxMs: 30 * 60_000,
  maxAttempts: 10,
  batchSize: 20,
  leaseMs: 60_000,
};

/** Delay before attempt `attempts + 1` after `attempts` failures: base · 2^(attempts − 1), capped. */
export function backoffDelayMs(failures: number, settings: Pick<OutboxSenderSettings, 'backoffBaseMs' | 'backoffMaxMs'>): number {
  return Math.min(settings.backoffMaxMs, settings.backoffBaseMs * 2 ** Math.max(0, failures - 1));
}

export type SendRoundOutcome = { sent: number; failed: number };

/**
 * The loop that delivers the outbox: lease due rows, send each over SMTP, record the outcome.
 * A failure is retried with exponential back-off until `maxAttempts`, then marked failed
 * (admins see it in GET /api/outbox).
 */
export class OutboxSender {
  private readonly settings: OutboxSenderSettings;
  private readonly loop: PollingLoop;

  constructor(
    private readonly ds: DataSource,
    private readonly mailer: Mailer,
    settings: Partial<OutboxSenderSettings> = {},
  ) {
    this.settings = { ...defaultOutboxSenderSettings, ...settings };
    // Always a full poll interval between rounds, even after a full batch.
    this.loop = new PollingLoop(
      async () => {
        await this.sendDue();
        return 'idle';
      },
      this.settings.pollMs,
      'outbox: a send round failed',
    );
  }

  start(): void {
    this.loop.start();
  }

  async stop(): Promise<void> {
    await this.loop.stop();
  }

  /** Sends what is due now; used by the loop and by tests that want no waiting. */
  async sendDue(): Promise<SendRoundOutcome> {
    const outcome = { sent: 0, failed: 0 };
    const batch = await leaseDueMail(this.ds, this.settings.batchSize, this.settings.leaseMs);
    for (const mail of batch) {
      try {
        await this.mailer.send({ to: [mail.to], subject: mail.subject, text: mail.text, html: mail.html });
        await markMailSent(this.ds, mail.id);
        outcome.sent++;
      } catch (err) {
        const failures = mail.attempts + 1;
        const next = failures >= this.settings.maxAttempts ? null : new Date(Date.now() + backoffDelayMs(failures, this.settings));
        await markMailAttemptFailed(this.ds, mail.id, err instanceof Error ? err.message : String(err), next);
        outcome.failed++;
      }
    }
    return outcome;
  }
}
