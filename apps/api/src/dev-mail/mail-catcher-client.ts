import { z } from 'zod';
import type { CaughtMail, CaughtMailSummary } from '@millrace/contracts';
import { AppError } from '../http/app-error';

/** How long the API waits for the local catcher before saying it is not answering. */
export const catcherTimeoutMs = 5_000;

/** The catcher's own answers (apps/mail-catcher/src/read-api.ts), checked at this boundary. */
const catcherSummarySchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  date: z.string(),
  receivedAt: z.string(),
});
const catcherMessageSchema = catcherSummarySchema.extend({ cc: z.array(z.string()), text: z.string(), html: z.string().nullable() });

type CatcherSummary = z.infer<typeof catcherSummarySchema>;

/** The Date header as ISO time; the time the catcher received it when the header is missing or unreadable. */
function isoDate(m: CatcherSummary): string {
  const parsed = new Date(m.date);
  return Number.isNaN(parsed.getTime()) ? m.receivedAt : parsed.toISOString();
}

const toSummary = (m: CatcherSummary): CaughtMailSummary => ({ id: m.id, from: m.from, to: m.to, subject: m.subject, date: isoDate(m) });

/** Reads the local mail catcher's HTTP read API (development and tests only). */
export class MailCatcherClient {
  constructor(private readonly baseUrl: string) {}

  /** Every caught message, newest first. */
  async list(): Promise<CaughtMailSummary[]> {
    const body = await this.fetchJson('/messages');
    const messages = z.array(catcherSummarySchema).parse(body).map(toSummary);
    return messages.sort((a, b) => b.date.localeCompare(a.date) || b.id.localeCompare(a.id));
  }

  private async fetchJson(path: string): Promise<unknown> {
    let response: Response;
    try {
      response = await fetch(`${this.baseUrl.replace(/\/+$/, '')}${path}`, { signal: AbortSignal.timeout(catcherTimeoutMs) });
    } catch {
      throw new AppError(502, 'mail_catcher_unavailable', `The local mail catcher at ${this.baseUrl} is not answering. Start it (./docker-free-start.sh does) and try again.`);
    }
    if (response.status === 404) throw AppError.notFound('No caught message with this id; the catcher may have been cleared.');
    if (!response.ok) throw new AppError(502, 'mail_catcher_unavailable', `The local mail catcher answered ${response.status}.`);
    return response.json();
  }

  async message(id: string): Promise<CaughtMail> {
    const m = catcherMessageSchema.parse(await this.fetchJson(`/messages/${encodeURIComponent(id)}`));
    return { ...toSummary(m), cc: m.cc, text: m.text, html: m.html };
  }
}
