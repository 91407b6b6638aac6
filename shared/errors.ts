/**
 * Every `code` the API sends in `{ error: { code, message, fields } }`, written once. The server's
 * AppError and the client's ApiError take only these, so a misspelt code fails the type check.
 */
export const ERROR_CODES = [
  // 400: the request itself
  'invalid_input',
  'invalid_json',
  'bad_request',
  'invalid_token',
  'invalid_document_key',
  'not_pdf',
  'import_invalid',
  // 400: an uploaded CSV file that cannot be read as the template
  'empty_file',
  'not_text',
  'not_utf8',
  'not_csv',
  'missing_columns',
  'unknown_columns',
  'duplicate_columns',
  'no_rows',
  'too_many_rows',
  // 401, 403, 404
  'unauthenticated',
  'invalid_credentials',
  'forbidden',
  'account_deactivated',
  'own_work',
  'cross_origin',
  'not_found',
  // 409: the state of what is changed
  'conflict',
  'stale',
  'wrong_status',
  'duplicate',
  'revision_open',
  'frozen',
  'owner_is_member',
  'self_change',
  'has_account',
  'last_admin',
  // 413, 415, 429
  'too_large',
  'unsupported_media_type',
  'unsupported_encoding',
  'too_many_attempts',
  'too_many_requests',
  // 5xx
  'internal',
  'unavailable',
  'storage_unavailable',
  'storage_failed',
  'mail_unavailable',
  'mail_failed',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

/** Codes the client gives errors that never reached the server, or whose answer had no code. */
export const CLIENT_ERROR_CODES = ['http_error', 'network', 'aborted'] as const;
export type ClientErrorCode = (typeof CLIENT_ERROR_CODES)[number];

/** Field path → what is wrong with it, e.g. { "loadCase.component.thickness": "must be greater than zero" }. */
export type FieldErrors = Record<string, string>;

/** The body of every error answer. */
export interface ErrorBodyDto {
  /** A refused file adds its row issues (row 1 = first data row), at most 500, and their count. */
  error: { code: ErrorCode; message: string; fields?: FieldErrors; issues?: { row: number; field: string; message: string }[]; issueCount?: number };
}
