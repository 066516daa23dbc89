import { ZodError } from 'zod';
import { AppError, badRequest, busy, type IssueItem } from './errors';

/** zod issues in the error shape of docs/api/README.md: a dotted path and a message each. */
export function zodIssues(error: ZodError): IssueItem[] {
  return error.issues.map((issue) => ({
    path: issue.path.map(String).join('.'),
    message: issue.message,
  }));
}

export function fromZod(error: ZodError): AppError {
  const issues = zodIssues(error);
  const first = issues[0];
  return badRequest(
    first ? `${first.path ? `${first.path}: ` : ''}${first.message}` : 'The request is not valid.',
    issues,
  );
}

/** Turns anything thrown into the JSON error body of docs/api/README.md. */
export function errorResponse(error: unknown): Response {
  const appError = error instanceof AppError ? error : error instanceof ZodError ? fromZod(error) : busyError(error);
  if (!appError) {
    console.error(error);
    return Response.json({ error: 'Something went wrong on our side.' }, { status: 500 });
  }
  const headers = new Headers();
  if (appError.extra.retryAfterSeconds !== undefined) {
    headers.set('Retry-After', String(appError.extra.retryAfterSeconds));
  }
  const body: { error: string; issues?: IssueItem[] } = { error: appError.message };
  if (appError.code === 'bad_request') body.issues = appError.extra.issues ?? [];
  return Response.json(body, { status: appError.status, headers });
}

/**
 * The database's write lock held too long by another process (SQLITE_BUSY after the busy
 * timeout): nothing was written, so the honest answer is "try again", 503 with Retry-After.
 */
export function busyError(error: unknown): AppError | null {
  const text =
    error instanceof Error
      ? `${error.name} ${error.message} ${String((error as { parent?: unknown }).parent ?? '')}`
      : '';
  if (!/SQLITE_BUSY|SequelizeTimeoutError/.test(text)) return null;
  return busy(1);
}
