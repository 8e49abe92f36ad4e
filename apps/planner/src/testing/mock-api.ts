import { vi } from 'vitest';

/**
 * A stand-in for the network edge in component tests: `fetch` answers from a table of handlers
 * keyed by "METHOD /path" (query string ignored). Every request is recorded so tests can read
 * what the page sent. An unhandled request fails the test loudly.
 */
export type RecordedRequest = { method: string; path: string; search: string; body: unknown };
export type Handler = (request: RecordedRequest) => Response | Promise<Response>;

export function json(body: unknown, init: { status?: number; headers?: Record<string, string> } = {}): Response {
  return new Response(JSON.stringify(body), {
    status: init.status ?? 200,
    headers: { 'Content-Type': 'application/json', ...init.headers },
  });
}

export function apiError(status: number, code: string, message: string, extra: Record<string, unknown> = {}, headers?: Record<string, string>) {
  return json({ error: { code, message, ...extra } }, { status, headers });
}

/** The last handler of a list answers every later call too. */
const next = (queue: Handler[]): Handler => (queue.length > 1 ? queue.shift()! : queue[0]);

/**
 * The planner asks who is signed in with GET /api/session. Tests may keep describing the
 * signed-in person as the answer of GET /api/me: without a 'GET /api/session' handler, that
 * answer is turned into the session's (200 → signed in as that person, 401 → signed out;
 * anything else passes through). A 'GET /api/session' handler, when given, always wins.
 */
async function sessionFromMe(handler: Handler, request: RecordedRequest): Promise<Response> {
  const me = await handler(request);
  if (me.status === 200) return json({ signedIn: true, person: await me.json() });
  if (me.status === 401) return json({ signedIn: false });
  return me;
}

export function mockApi(handlers: Record<string, Handler | Handler[]>) {
  const requests: RecordedRequest[] = [];
  const queues = new Map<string, Handler[]>();
  for (const [key, h] of Object.entries(handlers)) queues.set(key, Array.isArray(h) ? [...h] : [h]);
  const unhandled: string[] = [];

  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(typeof input === 'string' ? input : input instanceof URL ? input.href : input.url, 'http://localhost');
    const method = (init?.method ?? 'GET').toUpperCase();
    const body = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    const request = { method, path: url.pathname, search: url.search, body };
    requests.push(request);
    const key = `${method} ${url.pathname}`;
    const queue = queues.get(key);
    if ((!queue || queue.length === 0) && key === 'GET /api/session' && (queues.get('GET /api/me')?.length ?? 0) > 0) {
      return sessionFromMe(next(queues.get('GET /api/me')!), request);
    }
    if (!queue || queue.length === 0) {
      unhandled.push(key);
      return apiError(500, 'internal_error', `No test handler for ${key}`);
    }
    return next(queue)(request);
  });
  vi.stubGlobal('fetch', fetchMock);

  return {
    requests,
    unhandled,
    /** Replace or add the answers for one route. */
    on(key: string, handler: Handler | Handler[]) {
      queues.set(key, Array.isArray(handler) ? [...handler] : [handler]);
    },
    sent(method: string, path: string) {
      return requests.filter((r) => r.method === method && r.path === path);
    },
  };
}
