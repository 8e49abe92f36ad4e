import type { SMTPServer } from 'smtp-server';
import { listenOnLoopback } from './listen';
import type { MessageStore } from './message-store';
import { createSmtpListener } from './smtp-listener';

export type SmtpState = 'up' | 'down';

/**
 * The SMTP side of the catcher, which can be taken down and brought back on the same port while
 * the read API stays up, so tests can check what a sender does while its mail server is away.
 */
export class SmtpSwitch {
  private server: SMTPServer | undefined;
  private port: number;
  private change: Promise<unknown> = Promise.resolve();

  constructor(
    private readonly store: MessageStore,
    requestedPort: number,
    private readonly onError: (cause: Error) => void,
  ) {
    this.port = requestedPort;
  }

  get state(): SmtpState {
    return this.server ? 'up' : 'down';
  }

  /** The bound port (the requested one until the first start, when it may have been 0). */
  get boundPort(): number {
    return this.port;
  }

  up(): Promise<SmtpState> {
    return this.serialize(async (): Promise<SmtpState> => {
      if (this.server) return 'up';
      const server = createSmtpListener(this.store);
      // smtp-server re-emits socket and listener errors; without a listener Node would crash on them.
      server.on('error', (cause: Error) => this.onError(cause));
      this.port = await listenOnLoopback(server.server, this.port, 'SMTP');
      this.server = server;
      return 'up';
    });
  }

  /** Stops accepting mail: new connections are refused, open sessions are cut after 2 s. */
  down(): Promise<SmtpState> {
    return this.serialize(async (): Promise<SmtpState> => {
      const server = this.server;
      if (!server) return 'down';
      this.server = undefined;
      await new Promise<void>((resolve) => server.close(() => resolve()));
      return 'down';
    });
  }

  private serialize<T>(step: () => Promise<T>): Promise<T> {
    const next = this.change.then(step, step);
    this.change = next.catch(() => undefined);
    return next;
  }
}
