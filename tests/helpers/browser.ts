/// <reference lib="dom" />
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtempSync, rmSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { startTestApp } from './app';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import type { Role } from '../../shared/schemas/auth';

const CHROMIUM = '/usr/bin/chromium';
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface BrowserSession {
  baseUrl: string;
  context: BrowserContext;
  page: Page;
  close(): Promise<void>;
}

/** The built client and the API on a free loopback port, and Debian's chromium driving it. */
export async function startBrowserSession(options: { demoProject?: boolean } = {}): Promise<BrowserSession> {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: run npm test, which installs Debian's chromium`);
  if (!existsSync(path.resolve('dist/index.html'))) throw new Error('dist/ is missing: run npm test, which builds the client');
  const handle = await startTestApp(options);
  const server: Server = createServer(handle.app);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://localhost:${(server.address() as AddressInfo).port}`;
  const profile = mkdtempSync(path.join(tmpdir(), 'isobath-chromium-'));
  const context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM, args: ARGS, viewport: { width: 1400, height: 900 } });
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(15_000);
  return {
    baseUrl,
    context,
    page,
    close: async () => {
      await context.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await handle.stop();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in through the sign-in page with an address and password, and waits for the app's header. */
export async function signInWithPassword(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('signed-in-as').waitFor();
}

export async function signInThroughForm(page: Page, baseUrl: string, role: Role): Promise<void> {
  await signInWithPassword(page, baseUrl, `${role}@harrow.example`, DEMO_PASSWORD);
}

/** Ends the session's current sign-in (its cookies) and signs in as another account. */
export async function switchAccount(s: BrowserSession, page: Page, email: string, password: string): Promise<void> {
  await s.context.clearCookies();
  await signInWithPassword(page, s.baseUrl, email, password);
}
