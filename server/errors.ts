import type { ZodError } from 'zod';
import type { ErrorCode, FieldErrors } from '../shared/errors';

export type { ErrorCode, FieldErrors };

/** Problems in the rows of an uploaded file, kept structured (row 1 = first data row). */
export interface RowIssues {
  issues: { row: number; field: string; message: string }[];
  /** All issues found; `issues` may list only the first of them. */
  issueCount: number;
}

/**
 * An error the API reports to the caller as `{ error: { code, message, fields } }`; a file's
 * row problems add `issues` and `issueCount` beside the fields.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldErrors,
    readonly rows?: RowIssues,
  ) {
    super(message);
  }
}

/**
 * An outside service (the mail server, the object store) could not be reached (503) or refused the
 * request (502); `cause` keeps what it said, for the log.
 */
export class OutsideServiceError<C extends ErrorCode = ErrorCode> extends AppError {
  declare readonly code: C;
  constructor(
    status: 502 | 503,
    code: C,
    message: string,
    readonly cause?: unknown,
  ) {
    super(status, code, message);
  }
}

export const badRequest = (message: string, fields?: FieldErrors, code: ErrorCode = 'invalid_input', rows?: RowIssues) =>
  new AppError(400, code, message, fields, rows);
export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'The requested item') => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, code: ErrorCode = 'conflict') => new AppError(409, code, message);
export const unavailable = (message = 'The database is unavailable. Try again in a moment.') =>
  new AppError(503, 'unavailable', message);

/** Field path → first message, e.g. { "loadCase.component.thickness": "must be greater than zero" }. */
export function fieldErrorsFromZod(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    if (!(key in fields)) fields[key] = issue.message;
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields[[...issue.path.map(String), k].join('.')] = 'is not a recognised field';
    }
  }
  return fields;
}
