import type { AddressInfo, Server } from 'node:net';
import { LOOPBACK } from './catcher-config';

/** Listens on loopback; resolves with the bound port, rejects with a sentence naming the port. */
export function listenOnLoopback(server: Server, port: number, what: string): Promise<number> {
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
