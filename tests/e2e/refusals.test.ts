/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';

// What a viewer and a checker meet, at a desk (1440 px) and on a phone (390 px).
let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession({ demoProject: true });
});
afterAll(async () => {
  await s?.close();
});

describe('Refusals and landings in chromium', () => {
  for (const width of [1440, 390]) {
    it(`${width} px: a viewer gets a clear refusal inside the app for Evaluate, the Library desk and Admin, never the form`, async () => {
      const { page, baseUrl } = s;
      await page.setViewportSize({ width, height: 900 });
      await signInThroughForm(page, baseUrl, 'viewer');
      for (const path of ['/evaluate', '/library', '/admin/users']) {
        await page.goto(`${baseUrl}${path}`);
        const refusal = page.getByTestId('page-refused');
        await refusal.waitFor();
        expect(await refusal.textContent()).toMatch(/your role is Viewer/);
        // The app's header stays: the viewer can go elsewhere and sign out.
        expect(await page.getByTestId('signed-in-as').isVisible()).toBe(true);
        expect(await page.getByRole('button', { name: 'Sign out' }).isVisible()).toBe(true);
        expect(await page.getByRole('form', { name: 'Load case' }).count()).toBe(0);
      }
      expect(await page.getByTestId('page-refused').textContent()).toContain('Team administration is for administrators');
      await page.goto(`${baseUrl}/evaluate`);
      expect(await page.getByTestId('page-refused').textContent()).toContain('Evaluating load cases is for engineers, checkers, librarians and administrators');
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.getByLabel('E-mail').waitFor();
    });
  }

  it('a checker lands on what waits for them, and the projects list has an awaiting-check column', async () => {
    const { page, baseUrl } = s;
    await page.setViewportSize({ width: 1440, height: 900 });
    // The demo engineer submits a shortlist in the demo project the checker belongs to.
    await signInThroughForm(page, baseUrl, 'engineer');
    const projects = (await (await page.request.get(`${baseUrl}/api/projects`)).json()) as { items: { id: number; members: { email: string }[] }[] };
    const project = projects.items.find((p) => p.members.some((m) => m.email === 'checker@harrow.example'))!;
    const loadCases = (await (await page.request.get(`${baseUrl}/api/projects/${project.id}/load-cases`)).json()) as { items: { id: number }[] };
    const sets = (await (await page.request.get(`${baseUrl}/api/property-sets?family=acrylic`)).json()) as { items: { id: number }[] };
    const created = await (await page.request.post(`${baseUrl}/api/projects/${project.id}/shortlists`, { data: { loadCaseId: loadCases.items[0].id, name: 'Waiting list check' } })).json();
    await page.request.post(`${baseUrl}/api/shortlists/${created.id}/items`, { data: { propertySetId: sets.items[0].id, note: 'For the check' } });
    const current = await (await page.request.get(`${baseUrl}/api/shortlists/${created.id}`)).json();
    expect((await page.request.post(`${baseUrl}/api/shortlists/${created.id}/submit`, { data: { lockVersion: current.lockVersion } })).status()).toBe(200);
    await page.getByRole('button', { name: 'Sign out' }).click();

    await signInThroughForm(page, baseUrl, 'checker');
    await page.getByRole('heading', { name: 'Waiting for you' }).waitFor();
    const list = page.getByTestId('waiting-list');
    expect(await list.textContent()).toContain('Waiting list check');
    await page.goto(`${baseUrl}/projects`);
    const row = page.getByRole('row').filter({ has: page.getByRole('link', { name: (await (await page.request.get(`${baseUrl}/api/projects/${project.id}`)).json()).name }) });
    await page.getByRole('columnheader', { name: 'Awaiting check' }).waitFor();
    expect(Number(await row.getByTestId('awaiting-check-count').textContent())).toBeGreaterThanOrEqual(1);
    // The check dialog says whether any candidate misses its target.
    await page.goto(`${baseUrl}/shortlists/${created.id}`);
    await page.getByRole('button', { name: 'Check…' }).click();
    expect(await page.getByTestId('below-target').textContent()).toMatch(/meets its target|misses? (its|their) target/);
  });
});
