import type { DataSource } from 'typeorm';
import type { AppLucia } from './auth/lucia';
import type { Config } from './config';

/** One outgoing e-mail. */
export interface MailMessage {
  to: string[];
  subject: string;
  text: string;
  html?: string;
}

/** Sends mail (nodemailer over SMTP in the product; provided by the sign-off work). */
export interface Mailer {
  send(message: MailMessage): Promise<void>;
}

/** What createApp receives. */
export interface AppContext {
  dataSource: DataSource;
  config: Config;
  mailer?: Mailer;
}

/** What every area router receives: the app context plus the session service. */
export interface ApiContext extends AppContext {
  lucia: AppLucia;
}
