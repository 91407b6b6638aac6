import { afterEach, describe, expect, it } from 'vitest';
import { resetEnvCache } from '../config/env';
import { appLink } from './app-link';

const saved = { APP_URL: process.env.APP_URL, SESSION_SECRET: process.env.SESSION_SECRET };

function withAppUrl(url: string | undefined): void {
  if (url === undefined) delete process.env.APP_URL;
  else process.env.APP_URL = url;
  // A fixed session secret keeps .data untouched.
  process.env.SESSION_SECRET = 'app-link-test-secret-app-link-test-secret';
  resetEnvCache();
}

afterEach(() => {
  for (const [name, value] of Object.entries(saved)) {
    if (value === undefined) delete process.env[name];
    else process.env[name] = value;
  }
  resetEnvCache();
});

describe('appLink', () => {
  it('puts the path after APP_URL', () => {
    withAppUrl('https://isobath.harrow-sound.example');
    expect(appLink('/shortlists/12')).toBe('https://isobath.harrow-sound.example/shortlists/12');
  });

  it('drops the trailing slashes of APP_URL, so no link has a double slash', () => {
    withAppUrl('https://isobath.harrow-sound.example/desk//');
    expect(appLink('/welcome?token=abc')).toBe('https://isobath.harrow-sound.example/desk/welcome?token=abc');
  });

  it('links to the local server when APP_URL is unset', () => {
    withAppUrl(undefined);
    expect(appLink('/records/3')).toBe('http://localhost:3000/records/3');
  });
});
