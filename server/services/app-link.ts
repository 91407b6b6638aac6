import { env } from '../config/env';

/** The app's address for a path, for links in e-mails: `appLink('/records/4')`. */
export function appLink(path: string): string {
  return `${env().APP_URL.replace(/\/+$/, '')}${path.startsWith('/') ? path : `/${path}`}`;
}
