import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startFakes, type Fakes } from '../scripts/fakes';

// API and browser tests get their own fake S3 and SMTP catcher on free loopback ports; the
// variables set here reach the test workers, which start after this runs.
let fakes: Fakes | undefined;
let dataDir = '';

export async function setup(): Promise<void> {
  dataDir = mkdtempSync(path.join(tmpdir(), 'isobath-fakes-'));
  fakes = await startFakes({ dataDir, bucket: process.env.S3_BUCKET ?? 'isobath-documents' });
  process.env.S3_ENDPOINT = fakes.s3.endpoint;
  process.env.SMTP_HOST = fakes.smtp.host;
  process.env.SMTP_PORT = String(fakes.smtp.port);
  process.env.MAIL_CATCHER_DIR = fakes.mailDir;
}

export async function teardown(): Promise<void> {
  await fakes?.stop();
  if (dataDir) rmSync(dataDir, { recursive: true, force: true });
}
