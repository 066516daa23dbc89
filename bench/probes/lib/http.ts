/**
 * A browser-like caller over HTTP: keeps its session cookie, sends the app's own Origin on writes
 * (as the app's pages do) and its own x-forwarded-for, so one actor's sign-ins are not throttled
 * by another's (the server trusts loopback as a proxy, tests/e2e/global-setup.ts does the same).
 */
export interface Answer {
  status: number;
  contentType: string;
  text: string;
  /** The parsed body when it is JSON. */
  json: unknown;
}

export interface SendOptions {
  json?: unknown;
  /** A body sent as it is, with `contentType` (default application/json). */
  raw?: string;
  contentType?: string;
}

let nextAddress = 1;

export class Caller {
  cookie = '';
  readonly address = `10.77.0.${nextAddress++}`;
  constructor(
    readonly base: string,
    readonly name: string,
  ) {}

  async send(method: string, path: string, options: SendOptions = {}): Promise<Answer> {
    const headers = new Headers({ 'x-forwarded-for': this.address });
    if (this.cookie) headers.set('cookie', this.cookie);
    if (method !== 'GET' && method !== 'HEAD') headers.set('origin', this.base);
    let body: string | undefined;
    if (options.raw !== undefined) body = options.raw;
    else if (options.json !== undefined) body = JSON.stringify(options.json);
    if (body !== undefined) headers.set('content-type', options.contentType ?? 'application/json');
    let res: Response;
    try {
      res = await fetch(this.base + path, { method, headers, body, redirect: 'manual' });
    } catch (error) {
      // No answer at all (the server closed the connection): status 0, the reason as the text.
      const cause = (error as { cause?: { message?: string } }).cause?.message ?? String(error);
      return { status: 0, contentType: '', text: `no answer: ${cause}`, json: null };
    }
    for (const setCookie of res.headers.getSetCookie()) {
      const [pair] = setCookie.split(';');
      this.cookie = /=$/.test(pair) || /Max-Age=0/i.test(setCookie) ? '' : pair;
    }
    const text = await res.text();
    const contentType = res.headers.get('content-type') ?? '';
    let json: unknown = null;
    if (contentType.includes('json')) {
      try {
        json = JSON.parse(text);
      } catch {
        json = null;
      }
    }
    return { status: res.status, contentType, text, json };
  }

  /** The JSON of a call that must succeed (setting up the world), or an error naming it. */
  async ok<T = unknown>(method: string, path: string, json?: unknown): Promise<T> {
    const answer = await this.send(method, path, json === undefined ? {} : { json });
    if (answer.status >= 300)
      throw new Error(`${this.name} ${method} ${path} → ${answer.status} ${answer.text.slice(0, 300)}`);
    return answer.json as T;
  }

  async signIn(email: string, password: string): Promise<void> {
    await this.ok('POST', '/api/auth/sign-in', { email, password });
  }
}
