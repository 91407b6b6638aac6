/// <reference lib="dom" />
// The administrator's account-safety controls in chromium: revoking and resending an invitation,
// clearing a sign-in lock (each behind a confirmation), and the outgoing mail with its state.
// Harrow Sound demo data only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';

let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
  await signInThroughForm(s.page, s.baseUrl, 'admin');
});
afterAll(async () => {
  await s?.close();
});

describe('admin controls in chromium', () => {
  it('revokes one invitation and resends another, each after confirming', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/admin/users`);
    const form = page.getByRole('form', { name: 'Invite someone' });
    for (const email of ['isla.moar@harrow.example', 'fraser.linklater@harrow.example']) {
      await form.getByLabel('E-mail').fill(email);
      await form.getByRole('button', { name: 'Send invitation' }).click();
      await form.getByText(`Invitation sent to ${email}`).waitFor();
    }
    const table = page.getByRole('table', { name: 'Invitations' });
    const isla = table.getByRole('row', { name: /isla\.moar@harrow\.example/ });
    await isla.waitFor();
    expect(await isla.textContent()).toMatch(/waiting.*sent/);

    await isla.getByRole('button', { name: 'Revoke the invitation to isla.moar@harrow.example' }).click();
    const revoke = page.getByRole('dialog', { name: 'Revoke the invitation to isla.moar@harrow.example?' });
    // Cancelling changes nothing.
    await revoke.getByRole('button', { name: 'Cancel' }).click();
    expect(await isla.textContent()).toMatch(/waiting/);
    await isla.getByRole('button', { name: 'Revoke the invitation to isla.moar@harrow.example' }).click();
    await revoke.getByRole('button', { name: 'Revoke' }).click();
    await expect.poll(() => isla.textContent()).toMatch(/revoked/);
    expect(await isla.getByRole('button', { name: /Resend/ }).count()).toBe(0);

    const fraser = table.getByRole('row', { name: /fraser\.linklater@harrow\.example/ });
    await fraser.getByRole('button', { name: 'Resend the invitation to fraser.linklater@harrow.example' }).click();
    const resend = page.getByRole('dialog', { name: 'Send the invitation to fraser.linklater@harrow.example again?' });
    await resend.getByRole('button', { name: 'Send again' }).click();
    await resend.waitFor({ state: 'hidden' });
    expect(await fraser.textContent()).toMatch(/waiting.*sent/);
  });

  it('shows a sign-in lock and clears it after confirming; the account then signs in from there', async () => {
    const { page, baseUrl } = s;
    for (let i = 0; i < 5; i++) {
      const res = await page.request.post(`${baseUrl}/api/auth/login`, { data: { email: 'viewer@harrow.example', password: `guess-${i}` }, headers: { cookie: '' } });
      expect(res.status()).toBe(401);
    }
    const locked = await page.request.post(`${baseUrl}/api/auth/login`, { data: { email: 'viewer@harrow.example', password: DEMO_PASSWORD }, headers: { cookie: '' } });
    expect(locked.status()).toBe(429);

    await page.goto(`${baseUrl}/admin/users`);
    const table = page.getByRole('table', { name: 'Sign-in locks' });
    const row = table.getByRole('row', { name: /viewer@harrow\.example/ });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/5/);
    await row.getByRole('button', { name: /Clear the sign-in lock of viewer@harrow\.example/ }).click();
    const dialog = page.getByRole('dialog', { name: /Let viewer@harrow\.example sign in from .* again\?/ });
    await dialog.getByRole('button', { name: 'Clear the lock' }).click();
    await row.waitFor({ state: 'detached' });

    const again = await page.request.post(`${baseUrl}/api/auth/login`, { data: { email: 'viewer@harrow.example', password: DEMO_PASSWORD }, headers: { cookie: '' } });
    expect(again.status()).toBe(200);
  });

  it('lists the outgoing mail with how each message fared', async () => {
    const { page, baseUrl, context } = s;
    await context.clearCookies();
    await signInThroughForm(page, baseUrl, 'admin');
    await page.goto(`${baseUrl}/admin/mail`);
    const table = page.getByRole('table', { name: 'Outgoing mail' });
    const row = table.getByRole('row', { name: /fraser\.linklater@harrow\.example/ }).first();
    await row.waitFor();
    expect(await row.textContent()).toMatch(/You are invited to Isobath.*sent/);
  });
});
