import { readFile, mkdtemp, rm } from 'node:fs/promises';
import { gzipSync } from 'node:zlib';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { BENCH_USER } from './prepare';

/** Gzipped bytes of the JavaScript the first page loads: the entry script and its modulepreloads. */
export async function initialJsGzipBytes(distDir = 'dist'): Promise<{ bytes: number; files: string[] }> {
  const html = await readFile(path.join(distDir, 'index.html'), 'utf8');
  const files = [
    ...[...html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)].map((m) => m[1]),
    ...[...html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+\.js)"/g)].map((m) => m[1]),
  ];
  let bytes = 0;
  for (const f of files) {
    const body = await readFile(path.join(distDir, f));
    // Only React's development build prints this: a build made with NODE_ENV other than production.
    if (body.includes('Download the React DevTools')) throw new Error(`${f} is a development build: rebuild with NODE_ENV=production (scripts/lib.sh ensure_client_build)`);
    bytes += gzipSync(body).length;
  }
  return { bytes, files };
}

const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/**
 * Milliseconds from navigating to Evaluate until the ranked table of the demo load case shows,
 * in Debian's chromium, signed in: a full page load (HTML, scripts, session check, evaluation,
 * render) started from another page of the same site; median of five after one warm-up.
 */
export async function evaluateReadyMs(baseUrl: string): Promise<{ medianMs: number; runs: number[] }> {
  const profile = await mkdtemp(path.join(tmpdir(), 'isobath-bench-'));
  const context = await chromium.launchPersistentContext(profile, { executablePath: '/usr/bin/chromium', args: ARGS });
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(BENCH_USER.email);
    await page.getByLabel('Password').fill(BENCH_USER.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-as').waitFor();
    const runs: number[] = [];
    for (let i = 0; i < 6; i++) {
      // Start from a trivial page of the same site (as a user already in the app would).
      await page.goto(`${baseUrl}/isobath.svg`);
      const t0 = Date.now();
      await page.goto(`${baseUrl}/evaluate`);
      await page.getByRole('table', { name: 'Ranked candidates' }).locator('tbody tr').first().waitFor({ timeout: 30_000 });
      if (i > 0) runs.push(Date.now() - t0);
    }
    const sorted = [...runs].sort((a, b) => a - b);
    return { medianMs: sorted[Math.floor(sorted.length / 2)], runs };
  } finally {
    await context.close();
    await rm(profile, { recursive: true, force: true });
  }
}
