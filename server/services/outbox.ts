// The mail outbox (table mail_outbox): every message the app sends is a row first, written in the
// transaction of the change it reports where there is one, then delivered through SMTP — at once
// by the request that made it or by the worker — and tried again with a doubling wait until it is
// sent or MAIL_MAX_ATTEMPTS is used up, when it is marked failed for the administrators to see.
// Rows are claimed with a lease (UPDATE … WHERE id IN (SELECT … FOR UPDATE SKIP LOCKED)), so
// several processes share one outbox without sending a message twice.
// Bodies can carry one-time links, whose tokens the database otherwise holds only as hashes
// (decision 014): they are sealed with AES-256-GCM under a key derived from SESSION_SECRET, and
// dropped once the message is sent or given up. See docs/decisions/026-mail-outbox.md.
import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { env } from '../config/env';
import { AppError } from '../errors';
import { MailError, checkMail, sendMail } from './mail';

export type OutboxStatus = 'pending' | 'sent' | 'failed';

export interface OutgoingMail {
  to: string | string[];
  subject: string;
  text: string;
  /** What the message is about, e.g. `invitation:12`, so that record can show how its mail fared. */
  ref?: string;
}

export interface OutboxRow {
  id: number;
  kind: 'message' | 'password-reset';
  recipients: string[];
  subject: string;
  body: string | null;
  ref: string | null;
  status: OutboxStatus;
  attempts: number;
  nextAttemptAt: Date;
  lastError: string | null;
  createdAt: Date;
  sentAt: Date | null;
}

// ---- Sealed bodies -----------------------------------------------------------------------------

const sealKey = () => Buffer.from(hkdfSync('sha256', env().SESSION_SECRET, 'isobath-mail-outbox', 'message body', 32));

export function seal(text: string): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', sealKey(), iv);
  const data = Buffer.concat([cipher.update(text, 'utf8'), cipher.final()]);
  return `v1.${Buffer.concat([iv, cipher.getAuthTag(), data]).toString('base64')}`;
}

export function unseal(sealed: string): string {
  if (!sealed.startsWith('v1.')) throw new Error('not a sealed message body');
  const raw = Buffer.from(sealed.slice(3), 'base64');
  const decipher = createDecipheriv('aes-256-gcm', sealKey(), raw.subarray(0, 12));
  decipher.setAuthTag(raw.subarray(12, 28));
  return Buffer.concat([decipher.update(raw.subarray(28)), decipher.final()]).toString('utf8');
}

// ---- Jobs that become messages ----------------------------------------------------------------

/** Turns a queued job for `recipient` into the message to send, or null when there is none to send. */
export type OutboxJob = (recipient: string, transaction: Transaction) => Promise<Omit<OutgoingMail, 'to'> | null>;
const jobs = new Map<string, OutboxJob>();

/** A module that queues a kind of job (e.g. password-reset) says here how the worker prepares it. */
export function registerOutboxJob(kind: 'password-reset', job: OutboxJob): void {
  jobs.set(kind, job);
}

// ---- Queueing ----------------------------------------------------------------------------------

const recipientsOf = (to: string | string[]) => (Array.isArray(to) ? to : [to]);

/**
 * Queues a message inside the caller's transaction: it exists exactly when the change commits.
 * Checked as sendMail checks it (a 400 naming the field, which rolls the change back).
 */
export async function enqueueMail(transaction: Transaction | undefined, mail: OutgoingMail): Promise<number> {
  const checked = checkMail({ to: mail.to, subject: mail.subject, text: mail.text });
  const rows = await sequelize().query<{ id: number }>(
    `INSERT INTO mail_outbox (kind, recipients, subject, body, ref) VALUES ('message', :recipients::jsonb, :subject, :body, :ref) RETURNING id`,
    {
      replacements: { recipients: JSON.stringify(recipientsOf(checked.to)), subject: checked.subject, body: seal(checked.text), ref: mail.ref ?? null },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return rows[0].id;
}

/** Queues a job of a registered kind for one recipient (the worker prepares the message). */
export async function enqueueJob(kind: 'password-reset', recipient: string): Promise<number> {
  const rows = await sequelize().query<{ id: number }>(
    `INSERT INTO mail_outbox (kind, recipients) VALUES (:kind, :recipients::jsonb) RETURNING id`,
    { replacements: { kind, recipients: JSON.stringify([recipient]) }, type: QueryTypes.SELECT },
  );
  return rows[0].id;
}

/**
 * Tries to deliver the given queued rows now, waiting at most `waitMs`: 'sent' when all went,
 * 'queued' when any is left to the worker (mail server down or slow). Never throws for mail.
 */
export async function sendQueued(ids: number[], { waitMs = 2_000 }: { waitMs?: number } = {}): Promise<'sent' | 'queued'> {
  if (!ids.length) return 'sent';
  const run = track(deliverDue({ ids }));
  let timer: NodeJS.Timeout | undefined;
  const late = new Promise<null>((resolve) => {
    timer = setTimeout(() => resolve(null), waitMs);
  });
  try {
    const done = await Promise.race([run.then(() => true), late]);
    if (!done) return 'queued';
  } finally {
    clearTimeout(timer);
  }
  const rows = await sequelize().query<{ n: string }>(`SELECT count(*)::text AS n FROM mail_outbox WHERE id IN (:ids) AND status <> 'sent'`, {
    replacements: { ids },
    type: QueryTypes.SELECT,
  });
  return Number(rows[0].n) === 0 ? 'sent' : 'queued';
}

/** Queues a message (in its own statement) and tries to send it at once; for notices sent after a commit. */
export async function queueMail(mail: OutgoingMail, options?: { waitMs?: number }): Promise<'sent' | 'queued'> {
  return sendQueued([await enqueueMail(undefined, mail)], options);
}

// ---- Delivering --------------------------------------------------------------------------------

/** The wait before attempt n + 1 after n failed ones: MAIL_RETRY_SECONDS × 2^(n − 1), at most an hour. */
export const retryDelayMs = (attempts: number) => Math.min(3600_000, env().MAIL_RETRY_SECONDS * 1000 * 2 ** Math.max(0, attempts - 1));

/** A claim is a lease: a process that dies mid-send gives its rows back when it runs out. */
const LEASE_SECONDS = 120;

interface Claimed {
  id: number;
  kind: 'message' | 'password-reset';
  recipients: string[];
  subject: string;
  body: string | null;
  attempts: number;
}

async function claim(limit: number, ids?: number[]): Promise<Claimed[]> {
  return sequelize().query<Claimed>(
    `UPDATE mail_outbox SET attempts = attempts + 1, leased_until = now() + make_interval(secs => :lease), updated_at = now()
      WHERE id IN (
        SELECT id FROM mail_outbox
         WHERE status = 'pending' AND next_attempt_at <= now() AND (leased_until IS NULL OR leased_until < now())
           ${ids ? 'AND id IN (:ids)' : ''}
         ORDER BY next_attempt_at, id
         LIMIT :limit
         FOR UPDATE SKIP LOCKED)
      RETURNING id, kind, recipients, subject, body, attempts`,
    { replacements: { lease: LEASE_SECONDS, limit, ids: ids ?? [] }, type: QueryTypes.SELECT },
  );
}

/** A job becomes its message (or goes, when there is nothing to send), in one transaction. */
async function prepare(row: Claimed): Promise<Claimed | null> {
  if (row.kind === 'message') return row;
  const job = jobs.get(row.kind);
  if (!job) throw new Error(`no handler for outbox jobs of kind ${row.kind}`);
  return sequelize().transaction(async (transaction) => {
    const mail = await job(row.recipients[0], transaction);
    if (!mail) {
      await sequelize().query(`DELETE FROM mail_outbox WHERE id = :id`, { replacements: { id: row.id }, transaction });
      return null;
    }
    const checked = checkMail({ to: row.recipients, subject: mail.subject, text: mail.text });
    const body = seal(checked.text);
    await sequelize().query(`UPDATE mail_outbox SET kind = 'message', subject = :subject, body = :body, ref = :ref, updated_at = now() WHERE id = :id`, {
      replacements: { id: row.id, subject: checked.subject, body, ref: mail.ref ?? null },
      transaction,
    });
    return { ...row, kind: 'message', subject: checked.subject, body };
  });
}

function describe(err: unknown): string {
  const cause = err instanceof MailError ? (err.cause ?? err) : err;
  const text = cause instanceof Error ? `${(cause as { code?: string }).code ?? cause.name}: ${cause.message}` : String(cause);
  return text.slice(0, 500);
}

async function attempt(claimed: Claimed): Promise<OutboxStatus> {
  let row: Claimed | null = claimed;
  try {
    row = await prepare(claimed);
    if (!row) return 'sent';
    await sendMail({ to: row.recipients, subject: row.subject, text: unseal(row.body ?? '') });
  } catch (err) {
    const max = env().MAIL_MAX_ATTEMPTS;
    // A message the mail service refuses as invalid will never go: no point in trying again.
    const hopeless = err instanceof AppError && err.status === 400;
    const giveUp = hopeless || claimed.attempts >= max;
    const detail = describe(err);
    console.error(
      `[isobath] mail "${(row?.subject ?? claimed.subject).slice(0, 80)}" to ${claimed.recipients.length} recipient(s) not sent (attempt ${claimed.attempts} of ${max}${giveUp ? ', giving up' : ''}): ${detail}`,
    );
    await sequelize().query(
      giveUp
        ? `UPDATE mail_outbox SET status = 'failed', body = NULL, leased_until = NULL, last_error = :detail, updated_at = now() WHERE id = :id`
        : `UPDATE mail_outbox SET next_attempt_at = now() + make_interval(secs => :wait), leased_until = NULL, last_error = :detail, updated_at = now() WHERE id = :id`,
      { replacements: { id: claimed.id, detail, wait: retryDelayMs(claimed.attempts) / 1000 } },
    );
    return giveUp ? 'failed' : 'pending';
  }
  await sequelize().query(`UPDATE mail_outbox SET status = 'sent', sent_at = now(), body = NULL, leased_until = NULL, last_error = NULL, updated_at = now() WHERE id = :id`, {
    replacements: { id: claimed.id },
  });
  return 'sent';
}

export interface DeliveryReport {
  sent: number;
  retrying: number;
  failed: number;
}

/** Claims due rows (only `ids`, when given) and tries each once. Several callers may run at once. */
export async function deliverDue({ ids, limit = 20 }: { ids?: number[]; limit?: number } = {}): Promise<DeliveryReport> {
  const report: DeliveryReport = { sent: 0, retrying: 0, failed: 0 };
  for (;;) {
    const batch = await claim(limit, ids);
    for (const row of batch) {
      const status = await attempt(row);
      if (status === 'sent') report.sent++;
      else if (status === 'failed') report.failed++;
      else report.retrying++;
    }
    if (ids || batch.length < limit) return report;
  }
}

// ---- In this process: kicks, the worker, and waiting for both -------------------------------

const running = new Set<Promise<unknown>>();
function track<T>(p: Promise<T>): Promise<T> {
  running.add(p);
  void p.finally(() => running.delete(p)).catch(() => undefined);
  return p;
}

let kickQueued = false;
/** Delivers what is due soon, in the background (after a response has gone, for instance). */
export function kickOutbox(): void {
  if (kickQueued) return;
  kickQueued = true;
  setImmediate(() => {
    kickQueued = false;
    track(deliverDue()).catch((err: unknown) => console.error('[isobath] outbox:', describe(err)));
  });
}

/** Waits for this process's deliveries in flight (for shutdown and tests). */
export async function settleOutbox(): Promise<void> {
  while (kickQueued || running.size) {
    await Promise.allSettled([...running]);
    if (kickQueued) await new Promise((resolve) => setImmediate(resolve));
  }
}

/** Polls the outbox every `pollMs` and prunes old rows hourly; stop() waits for the current round. */
export function startOutboxWorker({ pollMs = 5_000 }: { pollMs?: number } = {}): { stop(): Promise<void> } {
  let stopped = false;
  let lastPrune = 0;
  let timer: NodeJS.Timeout | undefined;
  const round = async () => {
    try {
      await track(deliverDue());
      if (Date.now() - lastPrune > 3600_000) {
        lastPrune = Date.now();
        await track(pruneOutbox());
      }
    } catch (err) {
      // The database may be away for a moment; the next round tries again.
      console.error('[isobath] outbox:', describe(err));
    }
    if (!stopped) timer = setTimeout(() => void round(), pollMs);
  };
  timer = setTimeout(() => void round(), 0);
  return {
    stop: async () => {
      stopped = true;
      clearTimeout(timer);
      await settleOutbox();
    },
  };
}

/** Sent messages are kept a week, failed ones a month (for the administrators' list). */
export async function pruneOutbox(): Promise<void> {
  await sequelize().query(`DELETE FROM mail_outbox WHERE (status = 'sent' AND sent_at < now() - interval '7 days') OR (status = 'failed' AND updated_at < now() - interval '30 days')`);
}

// ---- Reading -----------------------------------------------------------------------------------

interface RawRow {
  id: number;
  kind: 'message' | 'password-reset';
  recipients: string[];
  subject: string;
  ref: string | null;
  status: OutboxStatus;
  attempts: number;
  next_attempt_at: Date;
  last_error: string | null;
  created_at: Date;
  sent_at: Date | null;
}
const fromRaw = (r: RawRow): OutboxRow => ({
  id: r.id,
  kind: r.kind,
  recipients: r.recipients,
  subject: r.subject,
  body: null,
  ref: r.ref,
  status: r.status,
  attempts: r.attempts,
  nextAttemptAt: r.next_attempt_at,
  lastError: r.last_error,
  createdAt: r.created_at,
  sentAt: r.sent_at,
});
const COLUMNS = 'id, kind, recipients, subject, ref, status, attempts, next_attempt_at, last_error, created_at, sent_at';

/** Messages newest first (never the bodies); password-reset jobs not yet prepared are left out. */
export async function listOutbox({ status, limit = 100 }: { status?: OutboxStatus; limit?: number } = {}): Promise<OutboxRow[]> {
  const rows = await sequelize().query<RawRow>(
    `SELECT ${COLUMNS} FROM mail_outbox WHERE kind = 'message' ${status ? 'AND status = :status' : ''} ORDER BY id DESC LIMIT :limit`,
    { replacements: { status: status ?? null, limit }, type: QueryTypes.SELECT },
  );
  return rows.map(fromRaw);
}

/** The newest message for each of the refs (e.g. each invitation's latest mail). */
export async function latestByRef(refs: string[]): Promise<Map<string, OutboxRow>> {
  const out = new Map<string, OutboxRow>();
  if (!refs.length) return out;
  const rows = await sequelize().query<RawRow>(`SELECT DISTINCT ON (ref) ${COLUMNS} FROM mail_outbox WHERE ref IN (:refs) ORDER BY ref, id DESC`, {
    replacements: { refs },
    type: QueryTypes.SELECT,
  });
  for (const r of rows) out.set(r.ref!, fromRaw(r));
  return out;
}
