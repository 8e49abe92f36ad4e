import { simpleParser, type AddressObject } from 'mailparser';
import type { CaughtMessage } from './caught-message';

function addresses(field: AddressObject | AddressObject[] | undefined): string[] {
  if (!field) return [];
  const list = Array.isArray(field) ? field : [field];
  const out: string[] = [];
  for (const group of list) {
    for (const entry of group.value) {
      if (entry.address) out.push(entry.address);
      for (const member of entry.group ?? []) if (member.address) out.push(member.address);
    }
  }
  return out;
}

/** Header lines as one string per lower-case name; folded lines unfolded, repeated headers joined by a newline. */
function headerRecord(lines: readonly { key: string; line: string }[]): Record<string, string> {
  const headers: Record<string, string> = {};
  for (const { key, line } of lines) {
    const colon = line.indexOf(':');
    const value = (colon >= 0 ? line.slice(colon + 1) : line).replace(/\r?\n[ \t]+/g, ' ').trim();
    headers[key] = key in headers ? `${headers[key]}\n${value}` : value;
  }
  return headers;
}

export interface Envelope {
  from: string;
  to: string[];
}

export async function parseMessage(id: string, raw: Buffer, envelope: Envelope, receivedAt: Date): Promise<CaughtMessage> {
  const parsed = await simpleParser(raw, { skipImageLinks: true, skipTextToHtml: true });
  const from = addresses(parsed.from)[0] ?? envelope.from;
  return {
    id,
    from,
    to: addresses(parsed.to),
    cc: addresses(parsed.cc),
    envelopeFrom: envelope.from,
    envelopeTo: envelope.to,
    subject: parsed.subject ?? '',
    date: (parsed.date ?? receivedAt).toISOString(),
    receivedAt: receivedAt.toISOString(),
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    headers: headerRecord(parsed.headerLines),
  };
}
