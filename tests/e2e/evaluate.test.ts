/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';

let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
  await signInThroughForm(s.page, s.baseUrl, 'engineer');
});
afterAll(async () => {
  await s?.close();
});

describe('Evaluate journey in chromium', () => {
  it('ranks the catalogue for the 1,200 m submersible viewport and names the governing mode', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/evaluate`);
    // The cautions stay on screen beside the results.
    await page.getByRole('complementary', { name: 'Cautions' }).waitFor();
    const table = page.getByRole('table', { name: 'Ranked candidates' });
    await table.waitFor();
    expect(await page.getByTestId('pressure-readout').textContent()).toMatch(/12\.\d\d MPa/);
    const summary = await page.getByTestId('evaluation-summary').textContent();
    expect(summary).toMatch(/Design pressure 12\.\d\d MPa/);
    expect(summary).toMatch(/governed by (Tension|Compression|Shear|Buckling)/);
    const firstRow = table.locator('tbody tr').first();
    expect(await firstRow.textContent()).toMatch(/Tension|Compression|Shear|Buckling/);
  });

  it('asks for the best 25 first and shows the rest on demand, best first', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/evaluate`);
    const table = page.getByRole('table', { name: 'Ranked candidates' });
    await table.waitFor();
    // Every published set: any transparency, any service range.
    await page.getByLabel('Transparency').selectOption('');
    await page.getByLabel('Service range must cover the design temperatures').uncheck();
    await page.getByRole('button', { name: 'Evaluate candidates' }).click();
    await page.getByTestId('evaluation-summary').filter({ hasText: 'best 25 shown' }).waitFor();
    const summary = (await page.getByTestId('evaluation-summary').textContent()) ?? '';
    const total = Number(summary.match(/(\d+) candidates? evaluated/)?.[1]);
    // The seeded catalogue has more published sets than the first page holds.
    expect(total).toBeGreaterThan(25);
    expect(summary).toContain('best 25 shown');
    const first = await table.locator('tbody tr').first().textContent();
    const more = page.getByTestId('more-results');
    expect(await more.textContent()).toBe(`Show ${Math.min(100, total) - 25} more`);
    await more.click();
    await page.getByTestId('evaluation-summary').filter({ hasNotText: 'best 25 shown' }).waitFor();
    // Every published set now (the table paints its rows progressively).
    await page.waitForFunction((n) => document.querySelectorAll('table[aria-label="Ranked candidates"] tbody tr').length === n, Math.min(100, total));
    expect(await table.locator('tbody tr').first().textContent()).toBe(first);
    if (total <= 100) expect(await more.count()).toBe(0);
  });

  it('draws the margin chart and the thickness sweep with where the governing mode changes', async () => {
    const { page } = s;
    await page.getByRole('img', { name: 'Margins by failure mode per candidate' }).waitFor();
    await page.getByRole('img', { name: /Safety factor against thickness for/ }).waitFor();
    expect(await page.getByTestId('mode-transitions').textContent()).toMatch(/governs across this range|gives way to/);
  });

  it('shows field errors and keeps the last table, marked as not for these inputs, when the thickness is negative', async () => {
    const { page } = s;
    await page.getByLabel(/^Thickness/).fill('-5');
    await page.getByRole('button', { name: 'Evaluate candidates' }).click();
    expect(await page.getByText('Thickness must be at least').isVisible()).toBe(true);
    expect(await page.getByRole('table', { name: 'Ranked candidates' }).isVisible()).toBe(true);
    expect(await page.getByTestId('stale-results').textContent()).toContain('Inputs changed — evaluate again');
  });

  it('re-evaluates a clamped flat disc and opens a candidate’s modes', async () => {
    const { page } = s;
    await page.getByLabel('Geometry').selectOption('flat-disc');
    await page.getByLabel(/Unsupported diameter/).fill('150');
    await page.getByLabel(/^Thickness/).fill('60');
    await page.getByLabel('Edge').selectOption('clamped');
    await page.getByRole('button', { name: 'Evaluate candidates' }).click();
    await expect.poll(async () => (await page.getByRole('button', { name: /Show modes of/ }).count()) > 0).toBe(true);
    await page.getByRole('button', { name: /Show modes of/ }).first().click();
    const modes = page.getByRole('table', { name: /^Modes of/ });
    await modes.waitFor();
    expect(await modes.textContent()).toContain('Roark');
  });

  it('evaluates a ring-stiffened hull section and shows each check with its collapse pressures', async () => {
    const { page } = s;
    await page.getByLabel('Geometry').selectOption('ring-stiffened-cylinder');
    await page.getByLabel('Transparency').selectOption('false');
    await page.getByLabel(/^Inner radius/).fill('1000');
    await page.getByLabel(/^Thickness/).fill('16.5');
    await page.getByLabel(/Length between bulkheads/).fill('6000');
    await page.getByLabel(/Frame spacing/).fill('500');
    await page.getByRole('button', { name: 'Evaluate candidates' }).click();
    await expect.poll(async () => (await page.getByTestId('evaluation-summary').textContent()) ?? '').toMatch(/governed by/);
    await page.getByRole('button', { name: /Show modes of HY-80/ }).first().click();
    const modes = page.getByRole('table', { name: /^Modes of HY-80/ }).first();
    await modes.waitFor();
    const text = (await modes.textContent()) ?? '';
    for (const check of ['interframe shell yield', 'interframe collapse', 'overall collapse', 'frame yield']) expect(text).toContain(check);
    expect(text).toMatch(/Elastic .* · yield .* → collapse/);
    expect(text).toMatch(/Johnson–Ostenfeld/);
  });
});
