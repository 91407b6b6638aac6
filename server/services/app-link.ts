import { env } from '../config/env';

/**
 * An absolute link into the app, for e-mails: APP_URL without its trailing slashes, then the
 * path, which starts with "/" (e.g. appLink(`/shortlists/${id}`)).
 */
export function appLink(path: string): string {
  return `${env().APP_URL.replace(/\/+$/, '')}${path.startsWith('/') ? path : `/${path}`}`;
}
