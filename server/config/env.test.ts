// The object-store and mail variables: defaults, the fake's key outside production, refusals.
import { afterEach, describe, expect, it } from 'vitest';
import { changeFeedUrl, env, resetEnvCache } from './env';

const NAMES = [
  'NODE_ENV',
  'SESSION_SECRET',
  'S3_ENDPOINT',
  'S3_REGION',
  'S3_BUCKET',
  'S3_ACCESS_KEY_ID',
  'S3_SECRET_ACCESS_KEY',
  'S3_FORCE_PATH_STYLE',
  'SMTP_HOST',
  'SMTP_PORT',
  'SMTP_SECURE',
  'SMTP_USER',
  'SMTP_PASS',
  'MAIL_FROM',
  'MAIL_CATCHER_DIR',
  'APP_URL',
  'TRUST_PROXY',
  'DATABASE_URL',
  'DATABASE_POOL_MAX',
  'CHANGE_FEED_DATABASE_URL',
];
const saved = Object.fromEntries(NAMES.map((n) => [n, process.env[n]]));

/** Only the given variables among NAMES are set (a fixed session secret keeps .data untouched). */
function withEnv(vars: Record<string, string>) {
  for (const name of NAMES) delete process.env[name];
  Object.assign(process.env, { SESSION_SECRET: 'env-test-secret-env-test-secret-env-test', ...vars });
  resetEnvCache();
  return env;
}

afterEach(() => {
  for (const name of NAMES) {
    if (saved[name] === undefined) delete process.env[name];
    else process.env[name] = saved[name];
  }
  resetEnvCache();
});

describe('storage and mail variables', () => {
  it('defaults to the local fakes outside production', () => {
    const e = withEnv({ NODE_ENV: 'development' })();
    expect(e.S3_ENDPOINT).toBeUndefined();
    expect(e.S3_REGION).toBe('us-east-1');
    expect(e.S3_BUCKET).toBe('isobath-documents');
    expect(e.S3_ACCESS_KEY_ID).toBe('S3RVER');
    expect(e.S3_SECRET_ACCESS_KEY).toBe('S3RVER');
    expect(e.S3_FORCE_PATH_STYLE).toBe(true);
    expect(e.SMTP_HOST).toBe('127.0.0.1');
    expect(e.SMTP_PORT).toBe(54341);
    expect(e.SMTP_SECURE).toBe(false);
    expect(e.SMTP_USER).toBeUndefined();
    expect(e.MAIL_FROM).toBe('Isobath <no-reply@isobath.example>');
    expect(e.MAIL_CATCHER_DIR).toBeUndefined();
    expect(e.APP_URL).toBeUndefined();
    expect(e.TRUST_PROXY).toBe(false);
  });

  it('requires APP_URL in production, and names it', () => {
    expect(() => withEnv({ NODE_ENV: 'production' })()).toThrow(/APP_URL/);
    expect(withEnv({ NODE_ENV: 'production', APP_URL: 'https://isobath.harrow-sound.example' })().APP_URL).toBe('https://isobath.harrow-sound.example');
  });

  it('trusts a proxy only when told which: a hop count or addresses; never "true"', () => {
    expect(withEnv({ NODE_ENV: 'development', TRUST_PROXY: 'false' })().TRUST_PROXY).toBe(false);
    expect(withEnv({ NODE_ENV: 'development', TRUST_PROXY: '1' })().TRUST_PROXY).toBe(1);
    expect(withEnv({ NODE_ENV: 'development', TRUST_PROXY: 'loopback, 10.0.0.0/8' })().TRUST_PROXY).toBe('loopback, 10.0.0.0/8');
    expect(() => withEnv({ NODE_ENV: 'development', TRUST_PROXY: 'true' })()).toThrow('TRUST_PROXY');
  });

  it('gives production no fake key: unset keys leave the SDK credential chain in charge', () => {
    const e = withEnv({ NODE_ENV: 'production', APP_URL: 'https://isobath.harrow-sound.example' })();
    expect(e.S3_ACCESS_KEY_ID).toBeUndefined();
    expect(e.S3_SECRET_ACCESS_KEY).toBeUndefined();
  });

  it('takes a real store and a real mail server from the environment', () => {
    const e = withEnv({
      NODE_ENV: 'production',
      S3_ENDPOINT: 'https://objects.harrow-sound.example',
      S3_REGION: 'eu-west-2',
      S3_BUCKET: 'harrow-sound-documents',
      S3_ACCESS_KEY_ID: 'AKIDEXAMPLE',
      S3_SECRET_ACCESS_KEY: 'secret-example',
      S3_FORCE_PATH_STYLE: 'false',
      SMTP_HOST: 'smtp.harrow-sound.example',
      SMTP_PORT: '465',
      SMTP_SECURE: 'true',
      SMTP_USER: 'isobath',
      SMTP_PASS: 'mail-secret',
      APP_URL: 'https://isobath.harrow-sound.example',
    })();
    expect(e).toMatchObject({
      S3_ENDPOINT: 'https://objects.harrow-sound.example',
      S3_REGION: 'eu-west-2',
      S3_BUCKET: 'harrow-sound-documents',
      S3_ACCESS_KEY_ID: 'AKIDEXAMPLE',
      S3_SECRET_ACCESS_KEY: 'secret-example',
      S3_FORCE_PATH_STYLE: false,
      SMTP_HOST: 'smtp.harrow-sound.example',
      SMTP_PORT: 465,
      SMTP_SECURE: true,
      SMTP_USER: 'isobath',
      SMTP_PASS: 'mail-secret',
      APP_URL: 'https://isobath.harrow-sound.example',
    });
  });

  it.each([
    [{ S3_ENDPOINT: 'not a url' }, 'S3_ENDPOINT'],
    [{ S3_ENDPOINT: 'ftp://objects.harrow-sound.example' }, 'S3_ENDPOINT'],
    [{ S3_FORCE_PATH_STYLE: 'yes' }, 'S3_FORCE_PATH_STYLE'],
    [{ SMTP_SECURE: '1' }, 'SMTP_SECURE'],
    [{ SMTP_PORT: '0' }, 'SMTP_PORT'],
    [{ S3_BUCKET: 'ab' }, 'S3_BUCKET'],
    [{ APP_URL: 'localhost:3000' }, 'APP_URL'],
    [{ S3_ACCESS_KEY_ID: 'only-the-id' }, 'S3_SECRET_ACCESS_KEY'],
    [{ SMTP_USER: 'only-the-user' }, 'SMTP_PASS'],
  ])('refuses %j, naming %s', (vars, name) => {
    expect(() => withEnv({ NODE_ENV: 'development', ...vars })()).toThrow(name);
  });
});

describe('database variables for a pooled deployment', () => {
  it('listens on DATABASE_URL unless the change feed is given its own direct connection', () => {
    withEnv({ NODE_ENV: 'development', DATABASE_URL: 'postgres://isobath@pooler.harrow-sound.example:6432/isobath' });
    expect(changeFeedUrl()).toBe('postgres://isobath@pooler.harrow-sound.example:6432/isobath');
    withEnv({
      NODE_ENV: 'development',
      DATABASE_URL: 'postgres://isobath@pooler.harrow-sound.example:6432/isobath',
      CHANGE_FEED_DATABASE_URL: 'postgres://isobath@db-primary.harrow-sound.example:5432/isobath',
    });
    expect(changeFeedUrl()).toBe('postgres://isobath@db-primary.harrow-sound.example:5432/isobath');
  });

  it('takes the pool size per worker, 10 by default, and refuses nonsense', () => {
    expect(withEnv({ NODE_ENV: 'development' })().DATABASE_POOL_MAX).toBe(10);
    expect(withEnv({ NODE_ENV: 'development', DATABASE_POOL_MAX: '4' })().DATABASE_POOL_MAX).toBe(4);
    expect(() => withEnv({ NODE_ENV: 'development', DATABASE_POOL_MAX: '0' })()).toThrow('DATABASE_POOL_MAX');
    expect(() => withEnv({ NODE_ENV: 'development', CHANGE_FEED_DATABASE_URL: 'not a url' })()).toThrow('CHANGE_FEED_DATABASE_URL');
  });
});
