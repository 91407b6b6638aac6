import type { ErrorRequestHandler, RequestHandler, Response } from 'express';
import { BaseError as SequelizeBaseError, ConnectionError, TimeoutError } from 'sequelize';
import { AppError, type ErrorCode, type FieldErrors, type RowIssues } from '../errors';
import type { ErrorBodyDto } from '../../shared/errors';

const PG_CONNECTION_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', '57P01', '57P03', '08006', '08001', '08003']);

function isDatabaseDown(err: unknown): boolean {
  if (err instanceof ConnectionError || err instanceof TimeoutError) return true;
  const code = (err as { code?: string; parent?: { code?: string } })?.code ?? (err as { parent?: { code?: string } })?.parent?.code;
  if (code && PG_CONNECTION_CODES.has(code)) return true;
  const message = String((err as Error)?.message ?? '');
  return /Connection terminated|connect ECONNREFUSED|timeout exceeded when trying to connect/i.test(message);
}

function sendError(res: Response, status: number, code: ErrorCode, message: string, fields?: FieldErrors, rows?: RowIssues): void {
  const body: ErrorBodyDto = { error: { code, message, ...(fields ? { fields } : {}), ...(rows ? { issues: rows.issues, issueCount: rows.issueCount } : {}) } };
  res.status(status).json(body);
}

export const notFoundApi: RequestHandler = (_req, res) => sendError(res, 404, 'not_found', 'No such API route.');

/** The one place errors become responses. Internals (stack, SQL) never reach the caller. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) return;
  if (err instanceof AppError) {
    sendError(res, err.status, err.code, err.message, err.fields, err.rows);
    return;
  }
  const status = (err as { status?: number; statusCode?: number }).status ?? (err as { statusCode?: number }).statusCode;
  const type = (err as { type?: string }).type;
  if (type === 'entity.parse.failed') {
    sendError(res, 400, 'invalid_json', 'The request body is not valid JSON.', { _: 'must be valid JSON' });
    return;
  }
  if (type === 'entity.too.large') {
    sendError(res, 413, 'too_large', 'The request body is too large.');
    return;
  }
  if (type === 'charset.unsupported' || type === 'encoding.unsupported') {
    sendError(res, 415, 'unsupported_encoding', 'Send the body as UTF-8 JSON.');
    return;
  }
  if (isDatabaseDown(err)) {
    sendError(res, 503, 'unavailable', 'The database is unavailable. Try again in a moment.');
    return;
  }
  if (typeof status === 'number' && status >= 400 && status < 500) {
    sendError(res, status, 'bad_request', 'The request could not be processed.');
    return;
  }
  if (err instanceof SequelizeBaseError && /invalid input syntax|out of range/i.test(err.message)) {
    sendError(res, 400, 'invalid_input', 'The request has invalid values.');
    return;
  }
  console.error(`[isobath] ${req.method} ${req.originalUrl} failed:`, err);
  sendError(res, 500, 'internal', 'Something went wrong on our side. It has been logged.');
};
