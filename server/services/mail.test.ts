// Sends through nodemailer to the local SMTP catcher started in-process on a free port.
import { mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startSmtpFake, type SmtpFake } from '../../scripts/fakes/smtp';
import { AppError } from '../errors';
import {
  CAUGHT_MAIL_ID,
  MailError,
  closeMail,
  getCaughtMail,
  listCaughtMail,
  mailTransport,
  sendMail,
} from './mail';
import { closedPort, serviceTestEnv } from './test-env';

const useEnv = serviceTestEnv(closeMail);
let root: string;
let mailDir: string;
let catcher: SmtpFake;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'isobath-mail-'));
  mailDir = path.join(root, 'mail');
  catcher = await startSmtpFake({ port: 0, mailDir });
  useEnv({
    NODE_ENV: 'test',
    SESSION_SECRET: 'mail-test-secret-mail-test-secret-mail',
    SMTP_HOST: catcher.host,
    SMTP_PORT: String(catcher.port),
    SMTP_SECURE: 'false',
    SMTP_USER: undefined,
    SMTP_PASS: undefined,
    MAIL_FROM: 'Isobath <no-reply@isobath.example>',
    MAIL_CATCHER_DIR: mailDir,
  });
});

afterAll(async () => {
  closeMail();
  await catcher?.stop();
  await rm(root, { recursive: true, force: true });
});

describe('sending mail to the catcher', () => {
  it('delivers a message that is saved as JSON with the agreed fields', async () => {
    const sent = await sendMail({
      to: 'pilot@harrow-sound.example',
      subject: 'Harrow Sound: design record ready for checking',
      text: 'The 1,200 m submersible viewport record is ready: http://localhost:3000/projects/1',
      html: '<p>The 1,200 m submersible viewport record is <a href="http://localhost:3000/projects/1">ready</a>.</p>',
    });
    expect(sent.accepted).toEqual(['pilot@harrow-sound.example']);
    expect(sent.rejected).toEqual([]);

    const names = await readdir(mailDir);
    const files = names.filter((n) => n.endsWith('.json'));
    expect(files).toHaveLength(1);
    // Written to a temp file and renamed: nothing else is left behind.
    expect(names.filter((n) => n.startsWith('.'))).toEqual([]);

    const saved = JSON.parse(await readFile(path.join(mailDir, files[0]), 'utf8'));
    expect(Object.keys(saved).sort()).toEqual(['from', 'html', 'id', 'receivedAt', 'subject', 'text', 'to']);
    expect(saved.id).toMatch(CAUGHT_MAIL_ID);
    expect(files[0]).toBe(`${saved.id}.json`);
    expect(new Date(saved.receivedAt).toISOString()).toBe(saved.receivedAt);
    expect(saved.from).toBe('Isobath <no-reply@isobath.example>');
    expect(saved.to).toEqual(['pilot@harrow-sound.example']);
    expect(saved.subject).toBe('Harrow Sound: design record ready for checking');
    expect(saved.text.trim()).toBe('The 1,200 m submersible viewport record is ready: http://localhost:3000/projects/1');
    expect(saved.html).toContain('<a href="http://localhost:3000/projects/1">ready</a>');

    await expect(getCaughtMail(saved.id)).resolves.toEqual(saved);
  });

  it('lists caught mail newest first, honours the limit, and skips files that are not messages', async () => {
    await sendMail({ to: ['surveyor@harrow-sound.example', 'checker@harrow-sound.example'], subject: 'Camera housing 4,000 m: returned', text: 'See comments.' });
    await sendMail({ to: 'chamber@harrow-sound.example', subject: 'Treatment chamber 5 bar: checked', text: 'Flat viewports checked.' });
    await writeFile(path.join(mailDir, 'not-json.json'), '{ this is not json');
    await writeFile(path.join(mailDir, '.half-written.json.tmp'), '{}');

    const all = await listCaughtMail({ limit: 50 });
    expect(all.map((m) => m.subject)).toEqual([
      'Treatment chamber 5 bar: checked',
      'Camera housing 4,000 m: returned',
      'Harrow Sound: design record ready for checking',
    ]);
    expect(all[1].to).toEqual(['surveyor@harrow-sound.example', 'checker@harrow-sound.example']);
    expect(all[1].html).toBeUndefined();
    const times = all.map((m) => Date.parse(m.receivedAt));
    expect([...times].sort((a, b) => b - a)).toEqual(times);

    const newest = await listCaughtMail({ limit: 1 });
    expect(newest.map((m) => m.subject)).toEqual(['Treatment chamber 5 bar: checked']);
    await expect(listCaughtMail({ limit: 0 })).rejects.toMatchObject({ status: 400 });
  });

  it('refuses message ids that are paths, even when the target file exists', async () => {
    // A message-shaped file one level above the catcher directory.
    await writeFile(
      path.join(root, 'outside.json'),
      JSON.stringify({ id: '../outside', receivedAt: new Date().toISOString(), from: 'x', to: [], subject: 's', text: 't' }),
    );
    for (const id of ['../etc/passwd', '../outside', '..', 'a/b', '..%2Foutside', 'name.json', '', '/etc/passwd']) {
      await expect(getCaughtMail(id), id).rejects.toMatchObject({ status: 400, code: 'invalid_input' });
    }
    await expect(getCaughtMail('20000101T000000000Z-00000000')).rejects.toMatchObject({ status: 404 });
  });

  it('lists nothing when the catcher directory is missing or not configured', async () => {
    useEnv({ MAIL_CATCHER_DIR: path.join(root, 'no-such-dir') });
    try {
      await expect(listCaughtMail({ limit: 10 })).resolves.toEqual([]);
      useEnv({ MAIL_CATCHER_DIR: undefined });
      await expect(listCaughtMail({ limit: 10 })).resolves.toEqual([]);
      await expect(getCaughtMail('20000101T000000000Z-00000000')).rejects.toMatchObject({ status: 404 });
    } finally {
      useEnv({ MAIL_CATCHER_DIR: mailDir });
    }
  });

  it('refuses a bad address or a subject that would inject headers, before connecting', async () => {
    const before = (await readdir(mailDir)).length;
    const badTo = sendMail({ to: 'not-an-address', subject: 'Hello', text: 'x' });
    await expect(badTo).rejects.toBeInstanceOf(AppError);
    await expect(sendMail({ to: 'not-an-address', subject: 'Hello', text: 'x' })).rejects.toMatchObject({
      status: 400,
      fields: { to: expect.any(String) },
    });
    await expect(
      sendMail({ to: 'pilot@harrow-sound.example', subject: 'Hello\r\nBcc: everyone@harrow-sound.example', text: 'x' }),
    ).rejects.toMatchObject({ status: 400, fields: { subject: expect.any(String) } });
    expect((await readdir(mailDir)).length).toBe(before);
  });

  it('throws MailError (503) when the server cannot be reached, without logging (the outbox logs and retries)', async () => {
    useEnv({ SMTP_PORT: String(await closedPort()) });
    const log = vi.spyOn(console, 'error').mockImplementation(() => {});
    try {
      const message = { to: 'pilot@harrow-sound.example', subject: 'Lost in transit', text: 'never arrives' };
      await expect(sendMail(message)).rejects.toBeInstanceOf(MailError);
      await expect(sendMail(message)).rejects.toMatchObject({ status: 503, code: 'mail_unavailable' });
      expect(log).not.toHaveBeenCalled();
    } finally {
      useEnv({ SMTP_PORT: String(catcher.port) });
    }
    await expect(sendMail({ to: 'pilot@harrow-sound.example', subject: 'Back again', text: 'arrives' })).resolves.toMatchObject({ accepted: ['pilot@harrow-sound.example'] });
    expect((await listCaughtMail({ limit: 1 }))[0].subject).toBe('Back again');
  });

  it('keeps one transport per process and requires TLS off the loopback interface', () => {
    expect(mailTransport()).toBe(mailTransport());
    const loopback = mailTransport().options as { requireTLS?: boolean; host?: string };
    expect(loopback.host).toBe('127.0.0.1');
    expect(loopback.requireTLS).toBe(false);
    try {
      useEnv({ SMTP_HOST: 'mail.harrow-sound.example', SMTP_PORT: '587' });
      expect((mailTransport().options as { requireTLS?: boolean }).requireTLS).toBe(true);
      useEnv({ SMTP_SECURE: 'true', SMTP_PORT: '465' });
      expect((mailTransport().options as { secure?: boolean }).secure).toBe(true);
    } finally {
      useEnv({ SMTP_HOST: catcher.host, SMTP_PORT: String(catcher.port), SMTP_SECURE: 'false' });
    }
  });
});
