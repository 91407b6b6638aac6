// A local SMTP catcher on 127.0.0.1: accepts every message (no AUTH, no TLS: loopback only)
// and saves each one as <id>.json in `mailDir`, written to a temp file and renamed into place
// so a reader never sees half a message. server/services/mail.ts lists what it caught.
import { randomBytes } from 'node:crypto';
import { mkdir, rename, rm, writeFile } from 'node:fs/promises';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { newCaughtMailId, type CaughtMail } from '../../server/services/mail';

export interface SmtpFakeOptions {
  /** 0 = any free port. */
  port?: number;
  mailDir: string;
  /** Largest message accepted, in bytes (SIZE extension, RFC 1870). */
  maxBytes?: number;
}

export interface SmtpFake {
  host: string;
  port: number;
  mailDir: string;
  stop(): Promise<void>;
}

const HOST = '127.0.0.1';

function addresses(value: AddressObject | AddressObject[] | undefined) {
  if (!value) return [];
  return (Array.isArray(value) ? value : [value]).flatMap((a) => a.value);
}

/** Header addresses as a person writes them: `Isobath <no-reply@isobath.example>`, unquoted. */
function displayAddresses(value: AddressObject | AddressObject[] | undefined): string {
  return addresses(value)
    .map((v) => (v.name ? `${v.name} <${v.address ?? ''}>` : (v.address ?? '')))
    .filter(Boolean)
    .join(', ');
}

/** Writes `data` as `file` atomically: a temp file beside it, then rename (atomic on one filesystem). */
async function writeAtomically(file: string, data: string): Promise<void> {
  const temp = path.join(path.dirname(file), `.${path.basename(file)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`);
  try {
    await writeFile(temp, data, { mode: 0o600 });
    await rename(temp, file);
  } catch (err) {
    await rm(temp, { force: true });
    throw err;
  }
}

export async function startSmtpFake({ port = 0, mailDir, maxBytes = 10 * 1024 * 1024 }: SmtpFakeOptions): Promise<SmtpFake> {
  await mkdir(mailDir, { recursive: true });
  // Ids sort by time; two messages in one millisecond still get increasing times.
  let lastTime = 0;
  const nextReceivedAt = () => {
    lastTime = Math.max(Date.now(), lastTime + 1);
    return new Date(lastTime);
  };
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: maxBytes,
    logger: false,
    banner: 'Isobath local mail catcher',
    closeTimeout: 1_000,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          if (stream.sizeExceeded) {
            callback(Object.assign(new Error('Message exceeds the fixed maximum message size'), { responseCode: 552 }));
            return;
          }
          const receivedAt = nextReceivedAt();
          const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
          const mail: CaughtMail = {
            id: newCaughtMailId(receivedAt, randomBytes(4).toString('hex')),
            receivedAt: receivedAt.toISOString(),
            // The header as the reader sees it ("Isobath <no-reply@…>"); the envelope when absent.
            from: displayAddresses(parsed.from) || envelopeFrom,
            // The envelope (RCPT TO): everyone the message was delivered to, Bcc included.
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            ...(typeof parsed.html === 'string' ? { html: parsed.html } : {}),
          };
          await writeAtomically(path.join(mailDir, `${mail.id}.json`), `${JSON.stringify(mail, null, 2)}\n`);
          callback(null, `Caught as ${mail.id}`);
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once('error', onError);
    server.listen(port, HOST, () => {
      server.off('error', onError);
      resolve();
    });
  });
  // After start, log and keep serving: a bad client must not end the catcher.
  server.on('error', (err) => console.error('[isobath] mail catcher:', err.message));
  const actualPort = (server.server.address() as AddressInfo).port;
  let stopped = false;
  return {
    host: HOST,
    port: actualPort,
    mailDir,
    async stop() {
      if (stopped) return;
      stopped = true;
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}
