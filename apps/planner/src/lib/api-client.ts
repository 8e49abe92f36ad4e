import { errorBodySchema, type DataIssue, type FieldError } from '@millrace/contracts';

/** An error answer of the API, parsed from the one error shape every route uses. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldError[];
  readonly issues: DataIssue[];
  /** Seconds to wait, from a 429's Retry-After header. */
  readonly retryAfterSeconds: number | null;

  constructor(init: {
    status: number;
    code: string;
    message: string;
    fields?: FieldError[];
    issues?: DataIssue[];
    retryAfterSeconds?: number | null;
  }) {
    super(init.message);
    this.name = 'ApiError';
    this.status = init.status;
    this.code = init.code;
    this.fields = init.fields ?? [];
    this.issues = init.issues ?? [];
    this.retryAfterSeconds = init.retryAfterSeconds ?? null;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

type RequestOptions = {
  body?: unknown;
  signal?: AbortSignal;
  /** Query parameters; undefined values are left out. */
  params?: Record<string, string | number | boolean | undefined>;
};

function urlFor(path: string, params?: RequestOptions['params']): string {
  if (!params) return path;
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== undefined) search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `${path}?${text}` : path;
}

async function toApiError(response: Response): Promise<ApiError> {
  const retryHeader = response.headers.get('Retry-After');
  const retryAfterSeconds = retryHeader && /^\d+$/.test(retryHeader) ? Number(retryHeader) : null;
  let payload: unknown = null;
  try {
    payload = await response.json();
  } catch {
    payload = null;
  }
  const parsed = errorBodySchema.safeParse(payload);
  if (parsed.success) {
    return new ApiError({ status: response.status, retryAfterSeconds, ...parsed.data.error });
  }
  return new ApiError({
    status: response.status,
    code: response.status >= 500 ? 'internal_error' : 'unexpected_answer',
    message: `The server answered ${response.status} ${response.statusText || ''} without an explanation.`.replace(/\s+without/, ' without'),
    retryAfterSeconds,
  });
}

async function request<T>(method: Method, path: string, options: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // A FormData body (file upload) is sent as multipart; the browser sets its boundary.
  const multipart = typeof FormData !== 'undefined' && options.body instanceof FormData;
  if (options.body !== undefined && !multipart) headers['Content-Type'] = 'application/json';
  let response: Response;
  try {
    response = await fetch(urlFor(path, options.params), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : multipart ? (options.body as FormData) : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({
      status: 0,
      code: 'network_unreachable',
      message: 'Millrace could not reach its server. Check that it is running, then try again.',
    });
  }
  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

/** The one way the planner talks to the API: JSON (or a multipart upload) in, JSON out, session cookie, typed errors. */
export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'body'>) => request<T>('GET', path, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>('POST', path, { ...options, body }),
  put: <T>(path: string, body: unknown, options?: RequestOptions) => request<T>('PUT', path, { ...options, body }),
  patch: <T>(path: string, body: unknown, options?: RequestOptions) => request<T>('PATCH', path, { ...options, body }),
  delete: <T>(path: string, options?: RequestOptions) => request<T>('DELETE', path, options),
};
