import { SMTPServer, type SMTPServerAddress } from 'smtp-server';
import type { MessageStore } from './message-store';

const MAX_MESSAGE_BYTES = 25 * 1024 * 1024;

function address(entry: SMTPServerAddress | false): string {
  return entry ? entry.address : '';
}

/**
 * A real SMTP server (RFC 5321) that accepts every message and hands it to the store. It accepts
 * any AUTH credentials so a sender configured with a user name still delivers, offers no STARTTLS
 * (loopback only, plain text is expected) and refuses messages above 25 MB.
 */
export function createSmtpListener(store: MessageStore): SMTPServer {
  return new SMTPServer({
    name: 'millrace-mail-catcher',
    banner: 'Millrace mail catcher (local development and tests only)',
    authOptional: true,
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    closeTimeout: 2_000,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'any' });
    },
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', (error) => callback(error));
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          const error = new Error('Message exceeds the 25 MB limit of the mail catcher') as Error & { responseCode: number };
          error.responseCode = 552;
          callback(error);
          return;
        }
        const envelope = {
          from: address(session.envelope.mailFrom),
          to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
        };
        store.add(Buffer.concat(chunks), envelope).then(
          (summary) => callback(null, `Message ${summary.id} caught`),
          (error: unknown) => callback(error instanceof Error ? error : new Error(String(error))),
        );
      });
    },
  });
}
