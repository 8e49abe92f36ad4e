export { readCatcherConfig, LOOPBACK, type CatcherConfig } from './catcher-config';
export { startMailCatcher, type RunningMailCatcher } from './mail-catcher';
export type { CaughtMessage, CaughtMessageSummary, CaughtMessageWithRaw } from './caught-message';
