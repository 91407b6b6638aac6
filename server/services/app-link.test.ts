import { afterEach, describe, expect, it } from 'vitest';
import { resetEnvCache } from '../config/env';
import { appLink, rememberListeningPort } from './app-link';

const saved = { APP_URL: process.env.APP_URL, SESSION_SECRET: process.env.SESSION_SECRET, PORT: process.env.PORT, NODE_ENV: process.env.NODE_ENV };

function withAppUrl(url: string | undefined): void {
  if (url === undefined) delete process.env.APP_URL;
  else process.env.APP_URL = url;
  // A fixed session secret keeps .data untouched.
  process.env.SESSION_SECRET = 'app-link-test-secret-app-link-test-secret';
  resetEnvCache();
}

afterEach(() => {
  rememberListeningPort(undefined);
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

  it('links to the local server on PORT when APP_URL is unset', () => {
    withAppUrl(undefined);
    delete process.env.PORT;
    resetEnvCache();
    expect(appLink('/records/3')).toBe('http://localhost:3000/records/3');
    process.env.PORT = '8080';
    resetEnvCache();
    expect(appLink('/welcome?token=abc')).toBe('http://localhost:8080/welcome?token=abc');
  });

  it('follows the port the server actually listens on (PORT=0 picks a free one)', () => {
    withAppUrl(undefined);
    process.env.PORT = '0';
    resetEnvCache();
    rememberListeningPort(41234);
    expect(appLink('/shortlists/2')).toBe('http://localhost:41234/shortlists/2');
  });

  it('keeps APP_URL over the listening port', () => {
    withAppUrl('https://isobath.harrow-sound.example');
    rememberListeningPort(41234);
    expect(appLink('/shortlists/2')).toBe('https://isobath.harrow-sound.example/shortlists/2');
  });

  it('refuses to start in production without APP_URL', () => {
    withAppUrl(undefined);
    process.env.NODE_ENV = 'production';
    resetEnvCache();
    expect(() => appLink('/records/3')).toThrow(/APP_URL .*required in production/);
  });
});
