import type { AddressInfo, Server as NetServer } from 'node:net';
import { LOOPBACK, type CatcherConfig } from './catcher-config';
import { MessageStore } from './message-store';
import { createReadApi } from './read-api';
import { createSmtpListener } from './smtp-listener';

export interface RunningMailCatcher {
  smtpPort: number;
  httpPort: number;
  /** Base URL of the read API, e.g. http://127.0.0.1:2580 */
  url: string;
  store: MessageStore;
  /** Closes both listeners (open SMTP sessions are cut after 2 s); the messages stay on disk. */
  stop(): Promise<void>;
}

function listen(server: NetServer, port: number, what: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (cause: NodeJS.ErrnoException) => {
      reject(
        new Error(
          cause.code === 'EADDRINUSE'
            ? `The mail catcher's ${what} port ${LOOPBACK}:${port} is already in use.`
            : `The mail catcher could not listen on ${what} port ${LOOPBACK}:${port}: ${cause.message}`,
        ),
      );
    };
    server.once('error', onError);
    server.listen(port, LOOPBACK, () => {
      server.removeListener('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

/** Starts the SMTP listener and the read API on loopback. Port 0 picks a free port (tests). */
export async function startMailCatcher(
  config: CatcherConfig,
  onError: (cause: Error) => void = () => {},
): Promise<RunningMailCatcher> {
  const store = await MessageStore.open(config.mailDir);
  const smtp = createSmtpListener(store);
  const http = createReadApi(store);
  // smtp-server re-emits socket and listener errors; without a listener Node would crash on them.
  smtp.on('error', (cause: Error) => onError(cause));
  const smtpPort = await listen(smtp.server, config.smtpPort, 'SMTP');
  let httpPort: number;
  try {
    httpPort = await listen(http, config.httpPort, 'HTTP');
  } catch (cause) {
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    throw cause;
  }
  let stopping: Promise<void> | undefined;
  return {
    smtpPort,
    httpPort,
    url: `http://${LOOPBACK}:${httpPort}`,
    store,
    stop() {
      stopping ??= Promise.all([
        new Promise<void>((resolve) => smtp.close(() => resolve())),
        new Promise<void>((resolve) => {
          http.close(() => resolve());
          http.closeAllConnections();
        }),
      ]).then(() => undefined);
      return stopping;
    },
  };
}
