/** One message as listed by the mail catcher's read API (apps/mail-catcher/src/read-api.ts). */
export interface CaughtMessage {
  id: string;
  to: string[];
  envelopeTo: string[];
  subject: string;
}

export interface CaughtMessageDetail extends CaughtMessage {
  text: string;
  html: string | null;
}

/** Waits until a message to `to` whose subject matches `subject` arrives (the outbox retries with back-off). */
export async function waitForMail(catcherUrl: string, to: string, subject: RegExp, seconds = 60): Promise<CaughtMessageDetail> {
  const until = Date.now() + seconds * 1000;
  let seen: string[] = [];
  while (Date.now() < until) {
    const res = await fetch(`${catcherUrl}/messages?to=${encodeURIComponent(to)}`);
    if (res.ok) {
      const list = (await res.json()) as CaughtMessage[];
      seen = list.map((m) => m.subject);
      const hit = list.find((m) => subject.test(m.subject));
      if (hit) return (await (await fetch(`${catcherUrl}/messages/${hit.id}`)).json()) as CaughtMessageDetail;
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`No e-mail to ${to} with a subject like ${subject} within ${seconds} s; subjects seen: ${JSON.stringify(seen)}`);
}
