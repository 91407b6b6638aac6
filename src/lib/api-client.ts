import type { ClientErrorCode, ErrorBodyDto, ErrorCode } from '@shared/errors';

/**
 * The only module that talks to the server (fetch, and XMLHttpRequest for uploads that report
 * progress). Errors arrive as ApiError with the server's field errors.
 */
/** A problem in one row of an uploaded file, as the server reports it (row 1 = first data row). */
export interface RowIssue {
  row: number;
  field: string;
  message: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    /** One of the server's codes (shared/errors.ts), or the client's own when no answer carried one. */
    readonly code: ErrorCode | ClientErrorCode,
    message: string,
    readonly fields: Record<string, string> = {},
    /** Row problems of an uploaded file (e.g. 400 import_invalid), structured; absent otherwise. */
    readonly rows?: { issues: RowIssue[]; issueCount: number },
  ) {
    super(message);
  }
}

/** The server's 409 `stale`: someone saved the record after this form read it (optimistic locking). */
/** What a failed request says, in the API's words; one the server never answered says so. */
export const errorText = (err: unknown) => (err instanceof ApiError ? err.message : 'The server did not answer. Try again.');

export const isStale = (err: unknown): err is ApiError => err instanceof ApiError && err.status === 409 && err.code === 'stale';

type Query = Record<string, string | number | boolean | undefined | null>;

export function toQueryString(query?: Query): string {
  if (!query) return '';
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) {
    if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  }
  const s = params.toString();
  return s ? `?${s}` : '';
}

let onUnauthenticated: (() => void) | undefined;
/** Called when the server answers 401 to a signed-in request (session ended elsewhere). */
export function setUnauthenticatedHandler(fn: () => void): void {
  onUnauthenticated = fn;
}

/** What came back with an error status: normally an ErrorBodyDto, but a proxy may answer with anything. */
type ErrorBody = Partial<ErrorBodyDto> | null;

function apiErrorFrom(status: number, path: string, data: ErrorBody): ApiError {
  const err = data?.error;
  if (status === 401 && path !== '/auth/login' && path !== '/auth/me') onUnauthenticated?.();
  if (status === 413 && !err) return new ApiError(413, 'too_large', 'The file is larger than the server accepts.');
  const rows = Array.isArray(err?.issues) ? { issues: err.issues, issueCount: err.issueCount ?? err.issues.length } : undefined;
  return new ApiError(status, err?.code ?? 'http_error', err?.message ?? `The server answered ${status}.`, err?.fields ?? {}, rows);
}

async function request<T>(method: string, path: string, body?: unknown, query?: Query): Promise<T> {
  let res: Response;
  try {
    res = await fetch(`/api${path}${toQueryString(query)}`, {
      method,
      credentials: 'same-origin',
      headers: body === undefined ? { accept: 'application/json' } : { accept: 'application/json', 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network', 'Cannot reach the Isobath server. Check your connection and try again.');
  }
  if (res.status === 204) return undefined as T;
  const data = await res.json().catch(() => null);
  if (!res.ok) throw apiErrorFrom(res.status, path, data as ErrorBody);
  return data as T;
}

export interface UploadOptions {
  /** Bytes sent so far of the whole request body. */
  onProgress?: (loaded: number, total: number) => void;
  /** The body has been sent; the server is now working on it. */
  onSent?: () => void;
  signal?: AbortSignal;
}

/**
 * POSTs a multipart form with upload progress. fetch cannot report how much of a request body
 * has been sent, so this one case uses XMLHttpRequest.
 */
export function upload<T>(path: string, form: FormData, options: UploadOptions = {}): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api${path}`);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) options.onProgress?.(e.loaded, e.total);
    };
    xhr.upload.onload = () => options.onSent?.();
    xhr.onload = () => {
      let data: unknown = null;
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        data = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(data as T);
      else reject(apiErrorFrom(xhr.status, path, data as ErrorBody));
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload was interrupted. Check your connection and try again.'));
    xhr.onabort = () => reject(new ApiError(0, 'aborted', 'The upload was cancelled.'));
    if (options.signal) {
      if (options.signal.aborted) return reject(new ApiError(0, 'aborted', 'The upload was cancelled.'));
      options.signal.addEventListener('abort', () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}

export const api = {
  get: <T>(path: string, query?: Query) => request<T>('GET', path, undefined, query),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  put: <T>(path: string, body?: unknown) => request<T>('PUT', path, body ?? {}),
  patch: <T>(path: string, body?: unknown) => request<T>('PATCH', path, body ?? {}),
  delete: <T>(path: string) => request<T>('DELETE', path),
  upload,
};
