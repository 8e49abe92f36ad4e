import nodemailer from 'nodemailer';
import type { MailMessage, Mailer } from '../app-context';
import type { Config } from '../config';

/** How long to wait for the SMTP server at each stage before the attempt counts as failed (ms). */
const smtpTimeoutMs = 10_000;

/** Sends mail over SMTP with nodemailer (the mail catcher in development and tests). */
export function createSmtpMailer(smtp: Config['smtp']): Mailer {
  const transport = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    connectionTimeout: smtpTimeoutMs,
    greetingTimeout: smtpTimeoutMs,
    socketTimeout: smtpTimeoutMs,
  });
  return {
    async send(message: MailMessage): Promise<void> {
      await transport.sendMail({
        from: smtp.from,
        to: message.to,
        subject: message.subject,
        text: message.text,
        ...(message.html ? { html: message.html } : {}),
      });
    },
  };
}
