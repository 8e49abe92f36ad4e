/** One message as the catcher keeps it. `to` comes from the To header; `envelopeTo` lists every RCPT TO (Bcc included). */
export interface CaughtMessageSummary {
  id: string;
  from: string;
  to: string[];
  envelopeFrom: string;
  envelopeTo: string[];
  subject: string;
  date: string;
  receivedAt: string;
}

export interface CaughtMessage extends CaughtMessageSummary {
  cc: string[];
  text: string;
  html: string | null;
  headers: Record<string, string>;
}

export interface CaughtMessageWithRaw extends CaughtMessage {
  raw: string;
}

export function summarize(message: CaughtMessage): CaughtMessageSummary {
  const { id, from, to, envelopeFrom, envelopeTo, subject, date, receivedAt } = message;
  return { id, from, to, envelopeFrom, envelopeTo, subject, date, receivedAt };
}
