// Outgoing mail through SMTP (nodemailer), and reading what the local catcher caught.
// The same code sends to the local catcher (scripts/fakes/smtp.ts) and to a real server: only
// SMTP_* variables change.
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import nodemailer, { type SMTPSentMessageInfo, type Transporter } from 'nodemailer';
import { z } from 'zod';
import { ROOT_DIR, env } from '../config/env';
import { OutsideServiceError, badRequest, fieldErrorsFromZod, notFound } from '../errors';

/** The SMTP server could not be reached (503) or refused the message (502). */
export class MailError extends OutsideServiceError<'mail_unavailable' | 'mail_failed'> {
  override name = 'MailError';
}

const sendMailSchema = z.strictObject({
  to: z.union([z.email(), z.array(z.email()).min(1).max(50)]),
  subject: z.string().trim().min(1).max(200).refine((s) => !/[\r\n]/.test(s), 'must be one line'),
  text: z.string().min(1),
  html: z.string().min(1).optional(),
});

export type SendMailInput = z.input<typeof sendMailSchema>;

export interface SentMail {
  messageId: string;
  accepted: string[];
  rejected: string[];
}

let transport: Transporter<SMTPSentMessageInfo> | undefined;

const LOOPBACK = /^(localhost|127(\.\d{1,3}){3}|::1|\[::1\])$/i;

/** The process's one SMTP transport, created on first use from SMTP_* and MAIL_FROM. */
export function mailTransport(): Transporter<SMTPSentMessageInfo> {
  if (transport) return transport;
  const e = env();
  transport = nodemailer.createTransport(
    {
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      // Off the loopback interface, a plain connection must upgrade with STARTTLS or fail:
      // no password or message crosses a network in the clear.
      requireTLS: !e.SMTP_SECURE && !LOOPBACK.test(e.SMTP_HOST),
      ...(e.SMTP_USER && e.SMTP_PASS ? { auth: { user: e.SMTP_USER, pass: e.SMTP_PASS } } : {}),
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    },
    { from: e.MAIL_FROM },
  );
  return transport;
}

/** Closes the transport. For shutdown and for tests that change SMTP_* variables. */
export function closeMail(): void {
  transport?.close();
  transport = undefined;
}

// Nodemailer's error codes for a server that could not be reached or talked to.
const UNREACHABLE = new Set(['ECONNECTION', 'ETIMEDOUT', 'ESOCKET', 'EDNS', 'ECONNREFUSED', 'ECONNRESET', 'ETLS', 'EPROXY']);

/** The message as it will be sent; a 400 AppError naming the field when it is not valid (e.g. a subject with a line break). */
export function checkMail(input: SendMailInput): z.output<typeof sendMailSchema> {
  const parsed = sendMailSchema.safeParse(input);
  if (!parsed.success) throw badRequest('The message is not valid.', fieldErrorsFromZod(parsed.error));
  return parsed.data;
}

/** Sends one message from MAIL_FROM. Throws a 400 AppError for bad input and MailError when sending fails. */
export async function sendMail(input: SendMailInput): Promise<SentMail> {
  const { to, subject, text, html } = checkMail(input);
  try {
    const info = await mailTransport().sendMail({ to, subject, text, ...(html ? { html } : {}) });
    return {
      messageId: info.messageId,
      accepted: info.accepted.map(String),
      rejected: info.rejected.map(String),
    };
  } catch (err) {
    const code = String((err as { code?: string })?.code ?? '');
    if (UNREACHABLE.has(code)) {
      throw new MailError(503, 'mail_unavailable', 'The mail server is unavailable. Try again in a moment.', err);
    }
    throw new MailError(502, 'mail_failed', 'The mail server did not accept the message.', err);
  }
}

// ---------------------------------------------------------------------------------------------
// Caught mail: the local catcher saves each message as <id>.json in MAIL_CATCHER_DIR.

export const caughtMailSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string().optional(),
});

export type CaughtMail = z.infer<typeof caughtMailSchema>;

/** Ids are letters, digits, dash and underscore: no dot or slash, so never a path. */
export const CAUGHT_MAIL_ID = /^[A-Za-z0-9][A-Za-z0-9_-]{0,127}$/;

/** A new id that sorts by time: 20261201T170853123Z-1a2b3c4d (UTC, then 8 random hex digits). */
export function newCaughtMailId(receivedAt: Date, randomHex: string): string {
  return `${receivedAt.toISOString().replace(/[-:.]/g, '')}-${randomHex}`;
}

function catcherDir(): string | undefined {
  const dir = env().MAIL_CATCHER_DIR;
  return dir ? path.resolve(ROOT_DIR, dir) : undefined;
}

async function readCaught(dir: string, id: string): Promise<CaughtMail | null> {
  let text: string;
  try {
    text = await readFile(path.join(dir, `${id}.json`), 'utf8');
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw err;
  }
  try {
    const parsed = caughtMailSchema.safeParse(JSON.parse(text));
    return parsed.success && parsed.data.id === id ? parsed.data : null;
  } catch {
    return null; // not JSON: skipped, as if it were not there
  }
}

/** The newest caught messages first. [] when MAIL_CATCHER_DIR is unset or missing. */
export async function listCaughtMail({ limit = 50 }: { limit?: number } = {}): Promise<CaughtMail[]> {
  if (!Number.isInteger(limit) || limit < 1 || limit > 500) {
    throw badRequest('The limit is not valid.', { limit: 'must be a whole number from 1 to 500' });
  }
  const dir = catcherDir();
  if (!dir) return [];
  let names: string[];
  try {
    names = await readdir(dir);
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    if (code === 'ENOENT' || code === 'ENOTDIR') return [];
    throw err;
  }
  // Ids sort by time, so the newest files come first by name; temp files (".name.tmp") are skipped.
  const ids = names
    .filter((n) => n.endsWith('.json'))
    .map((n) => n.slice(0, -'.json'.length))
    .filter((id) => CAUGHT_MAIL_ID.test(id))
    .sort()
    .reverse();
  const found: CaughtMail[] = [];
  for (const id of ids) {
    if (found.length >= limit) break;
    const mail = await readCaught(dir, id);
    if (mail) found.push(mail);
  }
  return found.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id.localeCompare(a.id));
}

/** One caught message. A 400 AppError for an id that is not one (e.g. a path); 404 when absent. */
export async function getCaughtMail(id: string): Promise<CaughtMail> {
  if (typeof id !== 'string' || !CAUGHT_MAIL_ID.test(id)) {
    throw badRequest('The message id is not valid.', { id: 'is not a message id' });
  }
  const dir = catcherDir();
  const mail = dir ? await readCaught(dir, id) : null;
  if (!mail) throw notFound('The message');
  return mail;
}
