import { LOOPBACK, type CatcherConfig } from './catcher-config';
import { listenOnLoopback } from './listen';
import { MessageStore } from './message-store';
import { createReadApi } from './read-api';
import { SmtpSwitch } from './smtp-switch';

export interface RunningMailCatcher {
  smtpPort: number;
  httpPort: number;
  /** Base URL of the read API, e.g. http://127.0.0.1:2580 */
  url: string;
  store: MessageStore;
  smtp: SmtpSwitch;
  /** Closes both listeners (open SMTP sessions are cut after 2 s); the messages stay on disk. */
  stop(): Promise<void>;
}

/** Starts the SMTP listener and the read API on loopback. Port 0 picks a free port (tests). */
export async function startMailCatcher(
  config: CatcherConfig,
  onError: (cause: Error) => void = () => {},
): Promise<RunningMailCatcher> {
  const store = await MessageStore.open(config.mailDir);
  const smtp = new SmtpSwitch(store, config.smtpPort, onError);
  await smtp.up();
  const http = createReadApi(store, smtp);
  let httpPort: number;
  try {
    httpPort = await listenOnLoopback(http, config.httpPort, 'HTTP');
  } catch (cause) {
    await smtp.down();
    throw cause;
  }
  let stopping: Promise<void> | undefined;
  return {
    smtpPort: smtp.boundPort,
    httpPort,
    url: `http://${LOOPBACK}:${httpPort}`,
    store,
    smtp,
    stop() {
      stopping ??= Promise.all([
        smtp.down(),
        new Promise<void>((resolve) => {
          http.close(() => resolve());
          http.closeAllConnections();
        }),
      ]).then(() => undefined);
      return stopping;
    },
  };
}
