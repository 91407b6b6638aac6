import { env } from '../config/env';

/** The port the server listens on, once it does (server/index.ts tells; PORT=0 picks a free one). */
let listeningPort: number | undefined;

export function rememberListeningPort(port: number | undefined): void {
  listeningPort = port;
}

/**
 * The app's public address: APP_URL (required in production), else — in development and tests —
 * this server on the port it actually listens on (PORT until it listens). Never taken from a
 * request's Host header, which the caller chooses.
 */
export function appBaseUrl(): string {
  const url = env().APP_URL;
  return url ? url.replace(/\/+$/, '') : `http://localhost:${listeningPort ?? env().PORT}`;
}

/**
 * An absolute link into the app, for e-mails: the app's address without its trailing slashes,
 * then the path, which starts with "/" (e.g. appLink(`/shortlists/${id}`)).
 */
export function appLink(path: string): string {
  return `${appBaseUrl()}${path.startsWith('/') ? path : `/${path}`}`;
}
