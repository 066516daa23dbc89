/**
 * The one table from a failure's kind to its HTTP status. Everything a handler or action throws
 * on purpose is an AppError; anything else is a bug and becomes a generic 500 without its
 * message (which could leak internals).
 */
export const ERROR_STATUS = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal: 500,
  unavailable: 503,
} as const;

export type ErrorCode = keyof typeof ERROR_STATUS;

export interface IssueItem {
  path: string;
  message: string;
}

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly extra: { issues?: IssueItem[]; retryAfterSeconds?: number } = {},
  ) {
    super(message);
    this.name = 'AppError';
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export const badRequest = (message: string, issues: IssueItem[] = []) =>
  new AppError('bad_request', message, { issues });
export const unauthorized = () => new AppError('unauthorized', 'Sign in to continue.');
export const forbidden = (message = 'Your role in this team does not allow that.') =>
  new AppError('forbidden', message);
export const notFound = (what = 'That') => new AppError('not_found', `${what} was not found.`);
export const conflict = (message: string) => new AppError('conflict', message);
/** The database could not take this write in time; nothing was written (503 with Retry-After). */
export const busy = (retryAfterSeconds = 1) =>
  new AppError('unavailable', 'The server is busy saving other changes. Nothing was saved; try again in a moment.', {
    retryAfterSeconds,
  });
