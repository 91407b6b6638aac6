import type { ErrorRequestHandler, RequestHandler } from 'express';
import { BaseError as SequelizeBaseError, ConnectionError, TimeoutError } from 'sequelize';
import { AppError } from '../errors';

const PG_CONNECTION_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', '57P01', '57P03', '08006', '08001', '08003']);

function isDatabaseDown(err: unknown): boolean {
  if (err instanceof ConnectionError || err instanceof TimeoutError) return true;
  const code = (err as { code?: string; parent?: { code?: string } })?.code ?? (err as { parent?: { code?: string } })?.parent?.code;
  if (code && PG_CONNECTION_CODES.has(code)) return true;
  const message = String((err as Error)?.message ?? '');
  return /Connection terminated|connect ECONNREFUSED|timeout exceeded when trying to connect/i.test(message);
}

export const notFoundApi: RequestHandler = (_req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: 'No such API route.' } });
};

/** The one place errors become responses. Internals (stack, SQL) never reach the caller. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) return;
  if (err instanceof AppError) {
    res.status(err.status).json({
      error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}), ...(err.rows ? { issues: err.rows.issues, issueCount: err.rows.issueCount } : {}) },
    });
    return;
  }
  const status = (err as { status?: number; statusCode?: number }).status ?? (err as { statusCode?: number }).statusCode;
  const type = (err as { type?: string }).type;
  if (type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'invalid_json', message: 'The request body is not valid JSON.', fields: { _: 'must be valid JSON' } } });
    return;
  }
  if (type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'too_large', message: 'The request body is too large.' } });
    return;
  }
  if (type === 'charset.unsupported' || type === 'encoding.unsupported') {
    res.status(415).json({ error: { code: 'unsupported_encoding', message: 'Send the body as UTF-8 JSON.' } });
    return;
  }
  if (isDatabaseDown(err)) {
    res.status(503).json({ error: { code: 'unavailable', message: 'The database is unavailable. Try again in a moment.' } });
    return;
  }
  if (typeof status === 'number' && status >= 400 && status < 500) {
    res.status(status).json({ error: { code: 'bad_request', message: 'The request could not be processed.' } });
    return;
  }
  if (err instanceof SequelizeBaseError && /invalid input syntax|out of range/i.test(err.message)) {
    res.status(400).json({ error: { code: 'invalid_input', message: 'The request has invalid values.' } });
    return;
  }
  console.error(`[isobath] ${req.method} ${req.originalUrl} failed:`, err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side. It has been logged.' } });
};
