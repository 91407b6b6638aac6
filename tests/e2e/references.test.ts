/// <reference lib="dom" />
// Changing a citation in use, in chromium: the demo librarian proposes a change to a reference a
// published set cites and submits it (keyboard only); she cannot approve her own change; a second
// librarian finds it in the review queue and approves it; the published set keeps the version it
// was approved with. A viewer opens the reference page read-only. Harrow Sound demo data only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserSession, signInThroughForm, type BrowserSession, switchAccount } from '../helpers/browser';
import { PropertySet, Reference, User } from '../../server/db/models';
import { hashPassword } from '../../server/auth/passwords';

// A second librarian for the four-eyes step (invented, Harrow Sound scenario).
const SECOND = { email: 'second.librarian@harrow.example', name: 'Ines Marrack', password: 'harrow-second-2026' };

let s: BrowserSession;
let setId: number;
let reference: { id: number; title: string };
let newTitle: string;
beforeAll(async () => {
  s = await startBrowserSession();
  await User.create({ email: SECOND.email, name: SECOND.name, role: 'librarian', passwordHash: await hashPassword(SECOND.password), lastLoginAt: null });
  const set = (await PropertySet.findOne({ where: { status: 'published' }, order: [['id', 'ASC']] }))!;
  setId = set.id;
  const ref = (await Reference.findByPk(set.referenceId!))!;
  reference = { id: ref.id, title: ref.title };
  newTitle = `${ref.title} (Harrow Sound re-issue)`;
});
afterAll(async () => {
  await s?.close();
});

const signInAs = (page: Page, email: string, password: string) => switchAccount(s, page, email, password);

describe('a reference change in chromium', () => {
  it('lets the demo librarian propose a change to a reference in use and submit it, but not approve it', async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.goto(`${baseUrl}/library/references`);
    await page.getByLabel('Search').fill(reference.title);
    await page.getByRole('table', { name: 'References' }).getByRole('link', { name: reference.title }).click();
    await page.waitForURL(new RegExp(`/library/references/${reference.id}$`));
    await page.getByRole('heading', { name: reference.title }).waitFor();
    await page.getByText('in use: changes are reviewed').waitFor();

    const form = page.getByRole('form', { name: 'Propose a change' });
    expect(await form.getByTestId('in-use-note').textContent()).toMatch(/becomes version 2/);
    await form.getByLabel('Title').fill(newTitle);
    // Keyboard only: Enter in a field sends the form.
    await form.getByLabel('Title').press('Enter');
    await page.getByText('Change proposed as version 2.', { exact: false }).waitFor();

    const proposed = page.getByTestId('proposed-change');
    expect(await proposed.getByRole('table', { name: 'Changes proposed in version 2' }).textContent()).toContain(newTitle);
    // The citation as published is unchanged.
    expect(await page.getByTestId('published-citation').textContent()).toContain(reference.title);
    expect(await page.getByTestId('published-citation').textContent()).not.toContain('re-issue');
    expect(await page.getByTestId('reference-version').textContent()).toBe('version 1');

    const submit = proposed.getByRole('button', { name: 'Submit for review…' });
    await submit.focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog', { name: 'Submit for review: version 2?' });
    await dialog.waitFor();
    // Escape leaves it as it was and gives the focus back to the button.
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    expect(await submit.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.press('Enter');
    await dialog.waitFor();
    await dialog.getByRole('button', { name: 'Submit for review', exact: true }).press('Enter');
    await page.getByText('Version 2 is in review.', { exact: false }).waitFor();

    // Four-eyes: the author sees why approving is closed to her, and the form waits for the review.
    expect(await proposed.getByTestId('four-eyes').textContent()).toMatch(/second librarian/);
    expect(await proposed.getByRole('button', { name: 'Approve…' }).isDisabled()).toBe(true);
    await page.getByTestId('change-in-review').waitFor();
    await page.goto(`${baseUrl}/library`);
    expect(await page.getByRole('table', { name: 'Your reference changes' }).textContent()).toContain(reference.title);
    expect(await page.getByRole('table', { name: 'Reference changes to review' }).count()).toBe(0);
  });

  it('shows it in a second librarian’s review queue, who approves it; the published set keeps version 1', async () => {
    const { page, baseUrl } = s;
    await signInAs(page, SECOND.email, SECOND.password);
    await page.goto(`${baseUrl}/library`);
    const queue = page.getByRole('table', { name: 'Reference changes to review' });
    await queue.waitFor();
    const row = queue.locator('tbody tr', { hasText: reference.title });
    expect(await row.textContent()).toMatch(/version 1 → 2/);
    expect(await row.textContent()).toContain('Tamsin Oyelaran');
    await row.getByRole('link', { name: reference.title }).click();
    await page.waitForURL(new RegExp(`/library/references/${reference.id}$`));

    await page.getByTestId('proposed-change').getByRole('button', { name: 'Approve…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Approve and publish: version 2?' });
    await dialog.waitFor();
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Cancel');
    await dialog.getByRole('button', { name: 'Approve and publish' }).click();
    await page.getByText('Version 2 is published.', { exact: false }).waitFor();
    await expect.poll(() => page.getByTestId('reference-version').textContent()).toBe('version 2');
    expect(await page.getByTestId('published-citation').textContent()).toContain(newTitle);
    const versions = await page.getByTestId('reference-versions').textContent();
    expect(versions).toMatch(/Version 2published/);
    expect(versions).toMatch(/Version 1superseded/);
    expect(await page.getByTestId('proposed-change').count()).toBe(0);
    // The form starts again from the new version, for its next change.
    const next = page.getByRole('form', { name: 'Propose a change' });
    expect(await next.getByLabel('Title').inputValue()).toBe(newTitle);
    expect(await next.getByTestId('in-use-note').textContent()).toMatch(/becomes version 3/);

    // The published set still cites the version it was approved with.
    await page.goto(`${baseUrl}/library/sets/${setId}`);
    const cited = page.getByTestId('set-reference');
    await cited.waitFor();
    expect(await cited.textContent()).toContain(reference.title);
    expect(await cited.textContent()).not.toContain('re-issue');
    expect(await page.getByTestId('set-reference-version').textContent()).toMatch(/Citation version 1; version 2 has been published since/);
  });

  it('lets the demo viewer read the reference, its versions and documents, without the editor', async () => {
    const { page, baseUrl } = s;
    await s.context.clearCookies();
    await signInThroughForm(page, baseUrl, 'viewer');
    await page.goto(`${baseUrl}/library/references/${reference.id}`);
    await page.getByRole('heading', { name: newTitle }).waitFor();
    expect(await page.getByTestId('reference-versions').textContent()).toMatch(/Version 1superseded/);
    expect(await page.getByRole('form', { name: /Propose a change|Edit reference|Edit the proposed change/ }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Approve…' }).count()).toBe(0);
    expect(await page.getByText('No document yet.').count()).toBe(1);
  });
});
