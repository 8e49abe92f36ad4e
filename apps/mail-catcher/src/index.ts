export { readCatcherConfig, LOOPBACK, type CatcherConfig } from './catcher-config';
export { startMailCatcher, type RunningMailCatcher } from './mail-catcher';
export type { SmtpState } from './smtp-switch';
export type { CaughtMessage, CaughtMessageSummary, CaughtMessageWithRaw } from './caught-message';
