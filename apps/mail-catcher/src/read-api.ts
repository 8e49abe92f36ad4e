import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { MessageStore } from './message-store';
import type { SmtpSwitch } from './smtp-switch';

function send(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'content-length': Buffer.byteLength(text) });
  res.end(text);
}

function error(res: ServerResponse, status: number, code: string, message: string): void {
  send(res, status, { error: { code, message } });
}

/**
 * The catcher's small read API (loopback, no authentication):
 *   GET    /health         → { status: 'ok', smtp: 'up' | 'down', messages: n }
 *   GET    /messages       → [{ id, from, to[], envelopeFrom, envelopeTo[], subject, date, receivedAt }], oldest first;
 *                            `?to=address` keeps the messages addressed to it (To header or envelope)
 *   GET    /messages/:id   → the message with cc[], text, html (null when none), headers, raw
 *   DELETE /messages       → { deleted: n } — clears every message (for tests)
 *   POST   /smtp/down      → { smtp: 'down' } — the SMTP port refuses connections (the read API stays up)
 *   POST   /smtp/up        → { smtp: 'up' }   — SMTP listens again on the same port
 */
export function createReadApi(store: MessageStore, smtp: SmtpSwitch): Server {
  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    const parts = url.pathname.split('/').filter(Boolean);
    const method = req.method ?? 'GET';

    if (parts.length === 1 && parts[0] === 'health') {
      if (method !== 'GET') return error(res, 405, 'method_not_allowed', `${method} is not allowed on /health; use GET.`);
      return send(res, 200, { status: 'ok', smtp: smtp.state, messages: store.list().length });
    }
    if (parts.length === 2 && parts[0] === 'smtp' && (parts[1] === 'up' || parts[1] === 'down')) {
      if (method !== 'POST') return error(res, 405, 'method_not_allowed', `${method} is not allowed on /smtp/${parts[1]}; use POST.`);
      return send(res, 200, { smtp: parts[1] === 'up' ? await smtp.up() : await smtp.down() });
    }
    if (parts[0] !== 'messages' || parts.length > 2) {
      return error(res, 404, 'not_found', `No such path: ${url.pathname}. Use /messages, /messages/:id, /smtp/down, /smtp/up or /health.`);
    }
    if (parts.length === 1) {
      if (method === 'GET') return send(res, 200, store.list(url.searchParams.get('to') ?? undefined));
      if (method === 'DELETE') return send(res, 200, { deleted: await store.clear() });
      return error(res, 405, 'method_not_allowed', `${method} is not allowed on /messages; use GET or DELETE.`);
    }
    if (method !== 'GET') {
      return error(res, 405, 'method_not_allowed', `${method} is not allowed on /messages/:id; use GET.`);
    }
    const id = decodeURIComponent(parts[1]);
    const message = await store.get(id);
    if (!message) return error(res, 404, 'not_found', `No message with id "${id}".`);
    return send(res, 200, message);
  }

  return createServer((req, res) => {
    handle(req, res).catch((cause: unknown) => {
      const message = cause instanceof Error ? cause.message : String(cause);
      if (!res.headersSent) error(res, 500, 'internal', `The mail catcher failed: ${message}`);
      else res.end();
    });
  });
}
