const SESSION_COOKIE = 'sphereline_session';

export interface HttpResult {
  status: number;
  body: unknown;
  headers: Headers;
  ms: number;
}

/**
 * A browser-like client over fetch (keep-alive): same-origin Origin on state-changing requests,
 * remembers the session cookie. `baseUrl` may be changed to move the same session to another
 * server process. A request that does not answer within `timeoutMs` throws (a hang is a failure).
 */
export class HttpClient {
  cookie: string | null = null;
  constructor(public baseUrl: string, readonly timeoutMs = 15_000) {}

  async request(
    method: string,
    path: string,
    body?: unknown,
    options: { headers?: Record<string, string>; raw?: string | Buffer; timeoutMs?: number } = {},
  ): Promise<HttpResult> {
    const headers: Record<string, string> = { ...options.headers };
    if (method !== 'GET' && method !== 'HEAD' && !('origin' in lower(headers))) headers.Origin = this.baseUrl;
    if (this.cookie && !('cookie' in lower(headers))) headers.Cookie = `${SESSION_COOKIE}=${this.cookie}`;
    let payload: string | Buffer | undefined = options.raw;
    if (payload === undefined && body !== undefined) {
      payload = JSON.stringify(body);
      headers['Content-Type'] ??= 'application/json';
    }
    const started = performance.now();
    const response = await fetch(`${this.baseUrl}${path}`, {
      method,
      headers,
      body: typeof payload === 'string' || payload === undefined ? payload : new Uint8Array(payload),
      signal: AbortSignal.timeout(options.timeoutMs ?? this.timeoutMs),
    });
    const text = await response.text();
    const ms = performance.now() - started;
    for (const line of response.headers.getSetCookie()) {
      if (line.startsWith(`${SESSION_COOKIE}=`)) this.cookie = line.split(';')[0]?.slice(SESSION_COOKIE.length + 1) || null;
    }
    let parsed: unknown = text;
    if ((response.headers.get('content-type') ?? '').includes('json')) {
      try {
        parsed = JSON.parse(text);
      } catch {
        parsed = text;
      }
    }
    return { status: response.status, body: parsed, headers: response.headers, ms };
  }

  get = (path: string) => this.request('GET', path);
  post = (path: string, body: unknown = {}) => this.request('POST', path, body);
  patch = (path: string, body: unknown = {}) => this.request('PATCH', path, body);
  delete = (path: string) => this.request('DELETE', path);

  async signIn(email: string, password: string): Promise<HttpResult> {
    const result = await this.post('/api/auth/sign-in', { email, password });
    if (result.status !== 200) throw new Error(`sign-in of ${email} failed: ${result.status} ${JSON.stringify(result.body)}`);
    return result;
  }
}

function lower(headers: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(headers).map(([k, v]) => [k.toLowerCase(), v]));
}

/** Runs `worker` over `items` with at most `concurrency` at a time. */
export async function pool<T>(items: readonly T[], concurrency: number, worker: (item: T, index: number) => Promise<void>) {
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(concurrency, items.length) }, async () => {
      while (next < items.length) {
        const index = next++;
        await worker(items[index] as T, index);
      }
    }),
  );
}
