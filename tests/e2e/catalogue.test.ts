/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';

let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
});
afterAll(async () => {
  await s?.close();
});

describe('catalogue journey in chromium', () => {
  it('sends an anonymous visitor to sign-in and shows field errors for an empty form', async () => {
    await s.page.goto(`${s.baseUrl}/catalogue`);
    await s.page.waitForURL(/\/sign-in\?next=%2Fcatalogue/);
    await s.page.getByRole('button', { name: 'Sign in' }).click();
    expect(await s.page.getByText('Enter a valid e-mail address').isVisible()).toBe(true);
  });

  it('signs in the demo engineer, filters by temperature, opens a material and shows its reference', async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, 'engineer');
    await page.waitForURL(/\/catalogue/);
    const rows = page.getByRole('table', { name: 'Property sets' }).locator('tbody tr');
    await rows.first().waitFor();
    const before = await rows.count();
    expect(before).toBeGreaterThanOrEqual(40);

    // Service temperature must cover −20 °C to 80 °C: the polymers drop out.
    await page.getByLabel(/Service from/).fill('-20');
    await page.getByLabel(/Service to/).fill('80');
    await page.getByLabel(/Service to/).press('Enter');
    await expect.poll(() => page.url()).toMatch(/tmin=-20.*tmax=80|tmax=80.*tmin=-20/);
    await expect.poll(() => rows.count()).toBeLessThan(before);
    // Polled: the list for -20 °C alone may still be on screen while the one for both ends loads.
    const families = () => page.getByRole('table', { name: 'Property sets' }).locator('tbody tr td:nth-child(2)').allInnerTexts();
    await expect.poll(families).not.toContain('Acrylic (PMMA)');

    await rows.first().getByRole('link').click();
    await page.waitForURL(/\/materials\/\d+/);
    const reference = page.getByTestId('reference');
    await reference.waitFor();
    expect((await reference.innerText()).length).toBeGreaterThan(20);
    expect(await page.getByRole('table', { name: 'Values' }).isVisible()).toBe(true);
  });

  it('switches the catalogue to US customary units', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/catalogue?family=acrylic`);
    await page.getByRole('radio', { name: 'US' }).click();
    const header = await page.getByRole('table', { name: 'Property sets' }).locator('thead').textContent();
    expect(header).toContain('ksi');
    await page.getByRole('radio', { name: 'SI' }).click();
    expect(await page.getByRole('table', { name: 'Property sets' }).locator('thead').textContent()).toContain('MPa');
  });
});
