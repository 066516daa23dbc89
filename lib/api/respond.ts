import { ZodError } from 'zod';
import { AppError, badRequest, type IssueItem } from './errors';

/** zod issues in the API.md shape: a dotted path and a message each. */
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

/** Turns anything thrown into the JSON error body of API.md. */
export function errorResponse(error: unknown): Response {
  const appError =
    error instanceof AppError ? error : error instanceof ZodError ? fromZod(error) : null;
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
