/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';

// "Usable at": the catalogue kept to the sets with a finite required thickness for a component at
// a depth, here a spherical hull shell at 4,000 m (Harrow Sound's survey vehicle depth).
let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
  await signInThroughForm(s.page, s.baseUrl, 'engineer');
});
afterAll(async () => {
  await s?.close();
});

describe('Catalogue filter by pressure in chromium', () => {
  for (const width of [1440, 390]) {
    it(`${width} px: "usable as a spherical shell at 4,000 m" lists only sets with a finite required thickness, with that thickness`, async () => {
      const { page, baseUrl } = s;
      await page.setViewportSize({ width, height: 900 });
      await page.goto(`${baseUrl}/catalogue`);
      const table = page.getByRole('table').first();
      await table.waitFor();
      const all = await table.locator('tbody tr').count();
      await page.getByLabel('Usable as').selectOption('sphere');
      await page.getByLabel(/^Design depth/).fill('4000');
      await page.getByLabel(/^Design depth/).press('Enter');
      await expect.poll(async () => (await page.getByTestId('usable-summary').textContent()) ?? '').toMatch(/^\d+ of \d+ sets have a finite required thickness/);
      expect(await page.getByRole('columnheader', { name: /Required t/ }).isVisible()).toBe(true);
      const shown = await table.locator('tbody tr').count();
      const thicknesses = (await page.getByTestId('usable-thickness').allTextContents()).map((t) => Number(t.replace(/,/g, '')));
      expect(thicknesses).toHaveLength(shown);
      for (const t of thicknesses) expect(Number.isFinite(t) && t > 0).toBe(true);
      expect(shown).toBeLessThanOrEqual(all);
      // The same answer as the API's evaluation of that load case.
      const res = await page.request.post(`${baseUrl}/api/evaluate`, {
        data: {
          loadCase: { pressure: { depth: 4000, latitude: 57, water: 'sea' }, temperature: { min: 2, max: 25 }, sustainedHours: 1000, cycles: 2000, component: { type: 'sphere', innerRadius: 0.8, thickness: 0.05 } },
          limit: 5000,
          form: 'full',
        },
      });
      const answer = (await res.json()) as { results: { requiredThickness: number | null }[] };
      expect(shown).toBe(answer.results.filter((r) => r.requiredThickness !== null && Number.isFinite(r.requiredThickness)).length);
      expect(page.url()).toContain('usable=sphere');
    });
  }
});
