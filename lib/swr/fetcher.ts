/**
 * The one way the browser talks to our route handlers. Every route answers errors as
 * `{ error, issues? }` (docs/api/README.md); this turns that body into a thrown `ApiError` that keeps the
 * status, the field issues and the whole body — forms need the issues, the editor needs the
 * 409 body (it carries the current review), and swr needs a rejected promise to show an error.
 */

export interface ApiIssue {
  path: string;
  message: string;
}

export class ApiError extends Error {
  readonly status: number;
  readonly issues: ApiIssue[];
  /** The parsed JSON error body, e.g. `{ error, current }` on a 409. */
  readonly body: Record<string, unknown>;

  constructor(status: number, message: string, issues: ApiIssue[] = [], body: Record<string, unknown> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.issues = issues;
    this.body = body;
  }

  /** Issues grouped by field path, the shape the form fields take (`errors[name]`). */
  fieldErrors(): Record<string, string[]> {
    const out: Record<string, string[]> = {};
    for (const issue of this.issues) (out[issue.path] ??= []).push(issue.message);
    return out;
  }
}

// What a person reads when the server did not say anything useful itself.
const FALLBACK_MESSAGES: Record<number, string> = {
  401: 'Your session has ended. Sign in again to continue.',
  403: 'Your role in this team does not allow that.',
  404: 'That was not found. It may have been deleted.',
  409: 'Someone else changed this in the meantime.',
  413: 'That file is too large.',
  415: 'That kind of file is not accepted here.',
  429: 'Too many requests. Wait a moment and try again.',
};

async function readBody(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

/** Builds the ApiError for a failed response. */
export async function toApiError(response: Response): Promise<ApiError> {
  const parsed = await readBody(response);
  const body =
    parsed && typeof parsed === 'object' && !Array.isArray(parsed) ? (parsed as Record<string, unknown>) : {};
  const message =
    typeof body.error === 'string' && body.error
      ? body.error
      : (FALLBACK_MESSAGES[response.status] ?? `The server answered ${response.status}. Try again in a moment.`);
  const issues = Array.isArray(body.issues)
    ? (body.issues as unknown[]).flatMap((item) =>
        item && typeof item === 'object' && typeof (item as ApiIssue).message === 'string'
          ? [{ path: String((item as ApiIssue).path ?? ''), message: (item as ApiIssue).message }]
          : [],
      )
    : [];
  return new ApiError(response.status, message, issues, body);
}

/**
 * fetch + JSON + errors. A network failure (offline, server restarting) becomes an ApiError with
 * status 0, so callers can tell "the server said no" from "we never reached it" and retry the
 * latter.
 */
export async function apiFetch<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init;
  const finalHeaders = new Headers(headers);
  finalHeaders.set('Accept', 'application/json');
  let body = rest.body;
  if (json !== undefined) {
    finalHeaders.set('Content-Type', 'application/json');
    body = JSON.stringify(json);
  }
  let response: Response;
  try {
    response = await fetch(url, { credentials: 'same-origin', ...rest, body, headers: finalHeaders });
  } catch {
    throw new ApiError(0, 'Could not reach the server. Check your connection; we will keep trying.');
  }
  if (!response.ok) throw await toApiError(response);
  if (response.status === 204) return undefined as T;
  return (await readBody(response)) as T;
}

/** The swr fetcher: GET and parse, errors thrown as ApiError. */
export const fetcher = <T>(url: string): Promise<T> => apiFetch<T>(url);

/** A query string from the set values only (undefined, null and '' are left out). */
export function query(params: Record<string, string | number | boolean | null | undefined>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null || value === '') continue;
    search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : '';
}

/** A message fit to show a person, whatever was thrown. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return 'Something went wrong. Try again.';
}

/**
 * A request whose answer is a stream of JSON lines (`Accept: application/x-ndjson`), e.g. a
 * library import that reports progress before its result. Each parsed line goes to `onLine` as
 * it arrives. An error status before the stream starts throws the usual ApiError.
 */
export async function apiStream(
  url: string,
  init: RequestInit & { json?: unknown },
  onLine: (line: Record<string, unknown>) => void,
): Promise<void> {
  const { json, headers, ...rest } = init;
  const finalHeaders = new Headers(headers);
  finalHeaders.set('Accept', 'application/x-ndjson');
  let body = rest.body;
  if (json !== undefined) {
    finalHeaders.set('Content-Type', 'application/json');
    body = JSON.stringify(json);
  }
  let response: Response;
  try {
    response = await fetch(url, { credentials: 'same-origin', ...rest, body, headers: finalHeaders });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, 'Could not reach the server. Check your connection and try again.');
  }
  if (!response.ok) throw await toApiError(response);
  if (!response.body) {
    const parsed = await readBody(response);
    if (parsed && typeof parsed === 'object') onLine({ type: 'result', ...(parsed as object) });
    return;
  }
  // A server that ignores the Accept header answers one JSON document: treat it as the result.
  const plainJson = !(response.headers.get('content-type') ?? '').includes('ndjson');
  const reader = response.body.pipeThrough(new TextDecoderStream()).getReader();
  let buffer = '';
  for (;;) {
    const { value, done } = await reader.read();
    if (value) buffer += value;
    if (!plainJson) {
      let newline = buffer.indexOf('\n');
      while (newline >= 0) {
        const line = buffer.slice(0, newline).trim();
        buffer = buffer.slice(newline + 1);
        if (line) onLine(JSON.parse(line) as Record<string, unknown>);
        newline = buffer.indexOf('\n');
      }
    }
    if (done) break;
  }
  if (buffer.trim()) {
    const parsed = JSON.parse(buffer) as Record<string, unknown>;
    onLine(plainJson ? { type: 'result', ...parsed } : parsed);
  }
}
