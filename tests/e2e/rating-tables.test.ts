/// <reference lib="dom" />
// The library desk's rating-table editor: a librarian drafts a table (grid filled from a CSV
// file), submits it, cannot approve it; a second librarian approves it and it is published.
// All values invented (Harrow Sound demo).
import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';
import { User } from '../../server/db/models';
import { hashPassword } from '../../server/auth/passwords';

const SECOND = { email: 'grid.reviewer@harrow.example', name: 'Eilidh Sorley', password: 'harrow-second-2026' };
let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
  await User.create({ email: SECOND.email, name: SECOND.name, role: 'librarian', passwordHash: await hashPassword(SECOND.password), lastLoginAt: null });
});
afterAll(async () => {
  await s?.close();
});

describe('rating tables on the library desk, in chromium', () => {
  it('drafts a table from a CSV grid, refuses the author’s own approval, and publishes it on a second librarian’s', async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.goto(`${baseUrl}/library/rating-tables`);
    await page.getByRole('heading', { name: 'Rating tables' }).waitFor();
    expect(await page.getByRole('table', { name: 'Published rating tables' }).textContent()).toMatch(/Table 1\.5\.2/);
    await page.getByRole('link', { name: 'New rating table' }).click();
    await page.getByLabel('Material').selectOption({ label: 'Cast acrylic (PMMA)' });
    const form = page.getByRole('form', { name: 'Rating table draft' });
    await form.waitFor();

    // Saving an empty draft names what is missing and sends nothing.
    await page.getByRole('button', { name: 'Save draft' }).click();
    expect(await form.getByText(/Name the table/).isVisible()).toBe(true);

    await page.getByLabel('Name').fill('Harrow chamber ports, lot 12 trials');
    await page.getByLabel('Material grade').fill('Harrow Sound cast acrylic lot 12');
    const dir = mkdtempSync(path.join(tmpdir(), 'isobath-grid-'));
    const csv = path.join(dir, 'grid.csv');
    writeFileSync(csv, 'design_pressure_bar,10,30\n2,0.16,0.18\n6,0.22,0.25\n');
    await page.getByLabel('CSV file with the grid').setInputFiles(csv);
    await page.getByText(/Read 2 rows from grid\.csv/).waitFor();
    expect(await page.getByLabel('t/Di at row 2, column 2').inputValue()).toBe('0.25');
    await page.getByLabel('Reference').selectOption({ index: 1 });
    await page.getByRole('button', { name: 'Save draft' }).click();
    await page.waitForURL(/\/library\/rating-tables\/\d+$/);
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Submit for review' }).click();
    await page.getByText('In review').first().waitFor();
    // four-eyes: the author's approve is disabled, with the reason
    expect(await page.getByRole('button', { name: 'Approve and publish' }).isDisabled()).toBe(true);
    expect(await page.getByText(/four-eyes rule/).first().isVisible()).toBe(true);
    const url = page.url();

    await s.context.clearCookies();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(SECOND.email);
    await page.getByLabel('Password').fill(SECOND.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('signed-in-as').waitFor();
    await page.goto(url);
    await page.getByRole('button', { name: 'Approve and publish' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Approve and publish' }).click();
    await page.getByText('Published').first().waitFor();
    expect(await page.getByRole('table', { name: /Minimum t\/Di/ }).textContent()).toContain('0.250');
  });
});
