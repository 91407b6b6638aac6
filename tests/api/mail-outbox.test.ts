// The mail outbox. Reproduces finding 7 of the account-safety assessment: an invitation sent while
// the mail server was down showed "waiting" and its mail was lost without a word. Here the app's
// mail goes to a catcher of this file's own, which is stopped and started again on the same port.
import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { startSmtpFake, type SmtpFake } from '../../scripts/fakes/smtp';
import { resetEnvCache } from '../../server/config/env';
import { closeMail } from '../../server/services/mail';
import { deliverDue, enqueueMail, settleOutbox, startOutboxWorker } from '../../server/services/outbox';
import { sequelize } from '../../server/db/sequelize';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let admin: Agent;
let catcher: SmtpFake | null = null;
let port = 0;
let mailDir = '';
const savedEnv = { ...process.env };

async function startCatcher(): Promise<void> {
  catcher = await startSmtpFake({ port, mailDir });
  port = catcher.port;
}
async function stopCatcher(): Promise<void> {
  await catcher?.stop();
  catcher = null;
}

interface Caught {
  to: string[];
  subject: string;
  text: string;
}
async function caught(): Promise<Caught[]> {
  const names = (await readdir(mailDir)).filter((n) => n.endsWith('.json'));
  return Promise.all(names.map(async (n) => JSON.parse(await readFile(path.join(mailDir, n), 'utf8')) as Caught));
}

async function until<T>(what: string, probe: () => Promise<T | undefined | null | false>, ms = 10_000): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

beforeAll(async () => {
  mailDir = await mkdtemp(path.join(tmpdir(), 'isobath-outbox-'));
  await startCatcher();
  // Short retries so a test sees several attempts; four at most.
  Object.assign(process.env, { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(port), MAIL_RETRY_SECONDS: '0.2', MAIL_MAX_ATTEMPTS: '4' });
  resetEnvCache();
  closeMail();
  handle = await startTestApp();
  admin = await signIn(handle.app, 'admin');
});
afterEach(async () => {
  if (!catcher) await startCatcher();
  vi.restoreAllMocks();
});
afterAll(async () => {
  await handle.stop();
  await stopCatcher();
  closeMail();
  process.env = savedEnv;
  resetEnvCache();
  await rm(mailDir, { recursive: true, force: true });
});

type InvitationRow = { id: number; email: string; state: string; mail: { status: string; attempts: number; lastError: string | null; nextAttemptAt: string | null } | null };
const invitationOf = async (id: number) => ((await admin.get('/api/admin/invitations')).body.items as InvitationRow[]).find((i) => i.id === id)!;

describe('mail while the mail server is down', () => {
  it('keeps an invitation sent while the catcher is stopped, shows the failure, and delivers it once the catcher is back', async () => {
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    await stopCatcher();
    const invited = await admin.post('/api/admin/invitations').send({ email: 'stormbound@harrow.example', role: 'engineer' });
    expect(invited.status).toBe(201);
    expect(invited.body.mail).toBe('queued');

    const row = await invitationOf(invited.body.id);
    expect(row.state).toBe('waiting');
    expect(row.mail).toMatchObject({ status: 'pending', attempts: 1, lastError: expect.stringMatching(/ECONNREFUSED|ECONNECTION|ESOCKET/), nextAttemptAt: expect.any(String) });
    const outbox = await admin.get('/api/admin/outbox?status=pending');
    expect(outbox.status).toBe(200);
    expect(outbox.body.items).toEqual([expect.objectContaining({ to: ['stormbound@harrow.example'], subject: 'You are invited to Isobath', status: 'pending', ref: `invitation:${invited.body.id}` })]);
    expect(JSON.stringify(outbox.body)).not.toContain('token=');
    // While it waits, the link's token is not readable in the database (decision 014 keeps tokens as hashes).
    const [bodies] = await sequelize().query(`SELECT body FROM mail_outbox WHERE ref = :ref`, { replacements: { ref: `invitation:${invited.body.id}` } });
    const body = (bodies as { body: string }[])[0].body;
    expect(body).toMatch(/^v1\./);
    expect(body).not.toContain('welcome');
    expect(log.mock.calls.some((c) => String(c[0]).includes('You are invited to Isobath') && String(c[0]).includes('attempt 1 of 4'))).toBe(true);

    await startCatcher();
    const worker = startOutboxWorker({ pollMs: 100 });
    try {
      const sent = await until('the invitation mail', async () => (await invitationOf(invited.body.id)).mail?.status === 'sent' && (await invitationOf(invited.body.id)));
      expect(sent.mail).toMatchObject({ status: 'sent', lastError: null, nextAttemptAt: null });
      expect(sent.mail!.attempts).toBeGreaterThanOrEqual(2);
    } finally {
      await worker.stop();
    }
    const mails = (await caught()).filter((m) => m.to.includes('stormbound@harrow.example'));
    expect(mails).toHaveLength(1);
    const token = mails[0].text.match(/\/welcome\?token=([A-Za-z0-9_-]+)/)![1];
    const accepted = await request(handle.app).post('/api/auth/invitations/accept').send({ token, name: 'Magnus Tulloch', password: 'a-long-passphrase-7' });
    expect(accepted.status).toBe(201);
    const [after] = await sequelize().query(`SELECT body FROM mail_outbox WHERE ref = :ref`, { replacements: { ref: `invitation:${invited.body.id}` } });
    expect((after as { body: string | null }[])[0].body).toBeNull();
  });

  it('gives up after MAIL_MAX_ATTEMPTS with a growing wait, and says so on the invitation and in the outbox; resending tries again', async () => {
    vi.spyOn(console, 'error').mockImplementation(() => undefined);
    await stopCatcher();
    const invited = await admin.post('/api/admin/invitations').send({ email: 'far.offshore@harrow.example', role: 'viewer' });
    expect(invited.body.mail).toBe('queued');
    const waits: number[] = [];
    const worker = startOutboxWorker({ pollMs: 50 });
    try {
      let lastNext = (await invitationOf(invited.body.id)).mail!.nextAttemptAt!;
      await until(
        'four failed attempts',
        async () => {
          const mail = (await invitationOf(invited.body.id)).mail!;
          // A new next-attempt time is written when an attempt has failed (not when it is claimed).
          if (mail.status === 'pending' && mail.nextAttemptAt && mail.nextAttemptAt !== lastNext) {
            waits.push(Date.parse(mail.nextAttemptAt) - Date.parse(lastNext));
            lastNext = mail.nextAttemptAt;
          }
          return mail.status === 'failed';
        },
        15_000,
      );
    } finally {
      await worker.stop();
    }
    const row = await invitationOf(invited.body.id);
    expect(row.mail).toMatchObject({ status: 'failed', attempts: 4, lastError: expect.any(String), nextAttemptAt: null });
    // Between next-attempt times: the wait after attempt n (0.2 s × 2^(n−1)) plus the poll's delay,
    // so each gap is longer than the one before.
    expect(waits.length).toBeGreaterThanOrEqual(1);
    for (let i = 1; i < waits.length; i++) expect(waits[i]).toBeGreaterThan(waits[i - 1]);
    const failed = (await admin.get('/api/admin/outbox?status=failed')).body.items as { ref: string; attempts: number }[];
    expect(failed.find((m) => m.ref === `invitation:${invited.body.id}`)).toMatchObject({ attempts: 4 });

    // Back up: a failed message is not sent by itself any more; resending makes a new one.
    await startCatcher();
    expect(await deliverDue()).toEqual({ sent: 0, retrying: 0, failed: 0 });
    const resent = await admin.post(`/api/admin/invitations/${invited.body.id}/resend`);
    expect(resent.body.mail).toBe('sent');
    expect((await invitationOf(invited.body.id)).mail).toMatchObject({ status: 'sent', attempts: 1 });
    expect((await caught()).filter((m) => m.to.includes('far.offshore@harrow.example'))).toHaveLength(1);
  });

  it('lets only administrators read the outbox', async () => {
    const engineer = await signIn(handle.app, 'engineer');
    expect((await engineer.get('/api/admin/outbox')).status).toBe(403);
    expect((await request(handle.app).get('/api/admin/outbox')).status).toBe(401);
    expect((await admin.get('/api/admin/outbox?status=lost')).status).toBe(400);
  });
});

describe('several processes on one outbox', () => {
  it('delivers each queued message exactly once when three deliverers claim at the same moment', async () => {
    await settleOutbox();
    const subjects = Array.from({ length: 15 }, (_, i) => `Harrow Sound tide table ${i + 1}`);
    await sequelize().transaction(async (transaction) => {
      for (const subject of subjects) await enqueueMail(transaction, { to: 'harbour.office@harrow.example', subject, text: 'Tide table attached in spirit.' });
    });
    const reports = await Promise.all([deliverDue({ limit: 4 }), deliverDue({ limit: 4 }), deliverDue({ limit: 4 })]);
    expect(reports.reduce((n, r) => n + r.sent, 0)).toBe(15);
    const got = (await caught()).filter((m) => m.subject.startsWith('Harrow Sound tide table')).map((m) => m.subject);
    expect(got.sort()).toEqual([...subjects].sort());
    const [rows] = await sequelize().query(`SELECT count(*)::int AS n FROM mail_outbox WHERE subject LIKE 'Harrow Sound tide table%' AND status = 'sent' AND attempts = 1`);
    expect((rows as { n: number }[])[0].n).toBe(15);
  });
});
