// Local stand-ins for the object store and the mail server, both on 127.0.0.1.
//   In code:   const fakes = await startFakes({ dataDir, bucket }); … await fakes.stop();
//   As script: tsx scripts/fakes/index.ts   (ports from ISOBATH_S3_PORT / ISOBATH_SMTP_PORT,
//              data under .data/s3 and .data/mail, or under ISOBATH_FAKES_DATA_DIR when set)
// The script prints one line starting "[isobath] fakes ready:" with the variables the app needs,
// and stops cleanly on SIGTERM or SIGINT.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ROOT_DIR, env } from '../../server/config/env';
import { startS3Fake, type S3Fake } from './s3';
import { startSmtpFake } from './smtp';

export interface FakesOptions {
  /** 0 or unset = any free port. */
  s3Port?: number;
  smtpPort?: number;
  /** Objects go to <dataDir>/s3, caught mail to <dataDir>/mail. */
  dataDir: string;
  bucket: string;
}

export interface Fakes {
  s3: { endpoint: string; port: number };
  smtp: { host: string; port: number };
  mailDir: string;
  stop(): Promise<void>;
}

export async function startFakes({ s3Port = 0, smtpPort = 0, dataDir, bucket }: FakesOptions): Promise<Fakes> {
  const mailDir = path.resolve(dataDir, 'mail');
  const s3: S3Fake = await startS3Fake({ port: s3Port, directory: path.resolve(dataDir, 's3'), bucket });
  let smtp;
  try {
    smtp = await startSmtpFake({ port: smtpPort, mailDir });
  } catch (err) {
    await s3.stop();
    throw err;
  }
  return {
    s3: { endpoint: s3.endpoint, port: s3.port },
    smtp: { host: smtp.host, port: smtp.port },
    mailDir,
    async stop() {
      await Promise.all([s3.stop(), smtp.stop()]);
    },
  };
}

function portFrom(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`${name} must be a port number (0-65535), got "${raw}"`);
  return port;
}

async function main(): Promise<void> {
  const dataDir = path.resolve(ROOT_DIR, process.env.ISOBATH_FAKES_DATA_DIR || '.data');
  const fakes = await startFakes({
    s3Port: portFrom('ISOBATH_S3_PORT', 54340),
    smtpPort: portFrom('ISOBATH_SMTP_PORT', 54341),
    dataDir,
    bucket: env().S3_BUCKET,
  });
  console.log(
    `[isobath] fakes ready: S3_ENDPOINT=${fakes.s3.endpoint} S3_BUCKET=${env().S3_BUCKET} ` +
      `SMTP_HOST=${fakes.smtp.host} SMTP_PORT=${fakes.smtp.port} MAIL_CATCHER_DIR=${fakes.mailDir}`,
  );
  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) process.exit(1); // a second signal: do not wait
    stopping = true;
    console.log(`[isobath] fakes: ${signal}, stopping`);
    fakes.stop().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error('[isobath] fakes: stop failed:', err);
        process.exit(1);
      },
    );
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
}

const runAsScript = process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (runAsScript) {
  main().catch((err: unknown) => {
    console.error('[isobath] fakes failed to start:', err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
