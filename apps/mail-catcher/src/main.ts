import { readCatcherConfig } from './catcher-config';
import { startMailCatcher } from './mail-catcher';

/** `node --import tsx apps/mail-catcher/src/main.ts`: runs until SIGTERM or SIGINT; messages stay on disk. */
async function main(): Promise<void> {
  const config = readCatcherConfig();
  const catcher = await startMailCatcher(config, (cause) => {
    console.error(`mail-catcher: SMTP error: ${cause.message}`);
  });
  console.log(
    `mail-catcher: SMTP on 127.0.0.1:${catcher.smtpPort}, read API on ${catcher.url}, messages in ${config.mailDir}`,
  );
  const shutdown = (signal: string) => {
    console.log(`mail-catcher: ${signal} received, stopping`);
    catcher.stop().then(
      () => process.exit(0),
      () => process.exit(1),
    );
    setTimeout(() => process.exit(1), 5_000).unref();
  };
  process.once('SIGTERM', () => shutdown('SIGTERM'));
  process.once('SIGINT', () => shutdown('SIGINT'));
}

main().catch((cause: unknown) => {
  console.error(`mail-catcher: ${cause instanceof Error ? cause.message : String(cause)}`);
  process.exit(1);
});
