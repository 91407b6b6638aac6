/// <reference lib="dom" />
// Windows sized the way the trade sizes them: the crewed 1,200 m cone and the 4,000 m camera
// housing cone, sized by the seeded Stachiw cone table (J. Eng. Ind. 94, 1972), with its source
// and what set the thickness shown in the ranking; the Material page lists the rating tables.
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

async function openModesOf(candidate: RegExp) {
  const { page } = s;
  const show = page.getByRole('button', { name: new RegExp(`Show modes of ${candidate.source}`) }).first();
  const hide = page.getByRole('button', { name: new RegExp(`Hide modes of ${candidate.source}`) }).first();
  await show.or(hide).waitFor();
  if (await show.isVisible()) await show.click();
  const summary = page.getByTestId('sizing-summary').first();
  await summary.waitFor();
  return summary;
}

describe('windows sized by rating tables, in chromium', () => {
  it('the crewed 1,200 m cone: the PVHO-grade acrylic is sized by the Stachiw table and ranks above uncovered windows', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/evaluate`);
    const table = page.getByRole('table', { name: 'Ranked candidates' });
    await table.waitFor();
    expect(await page.getByLabel(/For human occupancy/).isChecked()).toBe(true);
    const rows = table.locator('tbody tr');
    const first = await rows.first().textContent();
    expect(first).toMatch(/PVHO-grade/);
    expect(first).toMatch(/set by rating table/);
    // an uncovered window (glass, sapphire …) says so in its row
    expect(await table.getByText('Not covered for human occupancy').first().isVisible()).toBe(true);
    const summary = await openModesOf(/Cast acrylic.*typical values with temperature/);
    const text = await summary.textContent();
    expect(text).toMatch(/Thickness set by: rating table: Conical acrylic windows 90-150°/);
    expect(text).toMatch(/Stachiw/);
    expect(text).toMatch(/Journal of Engineering for Industry 94/);
    expect(text).toMatch(/design pressure is below the first row/); // 1,760 psi is below the table's 5,000 psi row: the conservative clamp
    expect(text).toMatch(/Human occupancy: covered/);
  });

  it('the 4,000 m camera housing cone is interpolated between the 5,000 and 10,000 psi rows', async () => {
    const { page } = s;
    await page.getByLabel(/Design depth/).fill('4000');
    await page.getByLabel(/For human occupancy/).uncheck();
    await page.getByLabel(/Minor diameter/).fill('50');
    await page.getByLabel(/^Thickness/).fill('40');
    await page.getByRole('button', { name: 'Evaluate candidates' }).click();
    await expect.poll(async () => (await page.getByTestId('evaluation-summary').textContent()) ?? '').toMatch(/Design pressure 40\.\d\d MPa/);
    const summary = await openModesOf(/Cast acrylic.*typical values with temperature/);
    const text = (await summary.textContent()) ?? '';
    expect(text).toMatch(/rating table: Conical acrylic windows 90-150°/);
    expect(text).toMatch(/Minimum ratio 0\.6[6-9]\d/);
    expect(text).not.toMatch(/design pressure is below the first row/);
    expect(text).not.toMatch(/Human occupancy/);
  });

  it('the Material page lists the cast acrylic rating tables with their grids and sources', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/catalogue`);
    await page.getByRole('link', { name: 'Cast acrylic (PMMA)' }).first().click();
    const section = page.getByRole('region', { name: 'Rating tables' });
    await section.waitFor();
    expect(await section.textContent()).toMatch(/Table 1\.5\.2/);
    const grids = section.getByRole('table', { name: /Minimum t\/Di against design pressure and temperature/ });
    expect(await grids.count()).toBe(3);
    expect(await section.textContent()).toContain('0.173'); // 10 bar, 24 °C of the classification rules' flat-window table
  });
});
