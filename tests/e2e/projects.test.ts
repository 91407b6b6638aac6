/// <reference lib="dom" />
import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';
import { DEMO_USERS } from '../../server/db/seeders/demo';
import type { Role } from '../../shared/schemas/auth';

// Harrow Sound Marine Works (invented): the engineer sets up a project for the two-person
// submersible's forward viewport, shortlists window materials and the checker signs it off.
const PROJECT = 'HS-2 forward viewport (1,200 m)';
const LOAD_CASE = 'Forward viewport, 90° cone at 1,200 m';
const SHORTLIST = 'Viewport window material';
const nameOf = (role: Role) => DEMO_USERS.find((u) => u.role === role)!.name;

let s: BrowserSession;
let shortlistUrl = '';

beforeAll(async () => {
  s = await startBrowserSession();
});
afterAll(async () => {
  await s?.close();
});

async function signInAs(page: Page, role: Role) {
  await s.context.clearCookies();
  await signInThroughForm(page, s.baseUrl, role);
}

describe('projects, shortlists and sign-off in chromium', () => {
  it('lets the demo engineer create a project and add the demo checker as a member', async () => {
    const { page } = s;
    await signInAs(page, 'engineer');
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Projects' }).click();
    await page.waitForURL(/\/projects$/);
    // A fresh database has no projects: the empty state explains what a project holds.
    await page.getByText('No projects yet').waitFor();
    expect(await page.getByText('Design records', { exact: true }).isVisible()).toBe(true);

    await page.getByRole('button', { name: 'New project…' }).click();
    const dialog = page.getByRole('dialog', { name: 'New project' });
    // An empty name is refused in the form, before anything is sent.
    await dialog.getByRole('button', { name: 'Create project' }).click();
    await dialog.getByText('Give the project a name').waitFor();
    await dialog.getByLabel('Name').fill(PROJECT);
    await dialog.getByLabel('Description').fill('Harrow Sound Marine Works: two-person research submersible rated to 1,200 m.');
    await dialog.getByRole('button', { name: 'Create project' }).click();
    await page.waitForURL(/\/projects\/\d+$/);
    await page.getByRole('heading', { name: PROJECT }).waitFor();

    await page.getByLabel('Add a member').selectOption({ label: `${nameOf('checker')} (Checker)` });
    await page.getByRole('button', { name: 'Add', exact: true }).click();
    const members = page.getByRole('list', { name: 'Members' });
    await members.getByText(nameOf('checker')).waitFor();
    expect(await members.getByRole('listitem').count()).toBe(2);
  });

  it('saves the evaluated load case to the project and shortlists two candidates with notes', async () => {
    const { page } = s;
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Evaluate' }).click();
    await page.getByRole('table', { name: 'Ranked candidates' }).waitFor();

    await page.getByRole('button', { name: 'Save to a project…' }).click();
    const save = page.getByRole('dialog', { name: 'Save the load case to a project' });
    await save.getByLabel('Project').selectOption({ label: PROJECT });
    await save.getByLabel('Name').fill(LOAD_CASE);
    await save.getByLabel('Notes').fill('Minor diameter fixed by the camera field of view.');
    await save.getByRole('button', { name: 'Save load case' }).click();
    await page.waitForURL(/\/evaluate\?loadCase=\d+$/);
    const banner = page.getByTestId('saved-load-case');
    await banner.waitFor();
    expect(await banner.textContent()).toContain(LOAD_CASE);
    await page.getByRole('table', { name: 'Ranked candidates' }).waitFor();

    const shortlistButtons = page.getByRole('button', { name: /^Add .+ to a shortlist$/ });
    await expect.poll(() => shortlistButtons.count()).toBeGreaterThan(1);

    // First candidate: a new shortlist (the caller has none for this load case yet).
    await shortlistButtons.nth(0).click();
    let dialog = page.getByRole('dialog', { name: 'Add to a shortlist' });
    await dialog.getByRole('radio', { name: 'A new shortlist' }).waitFor();
    expect(await dialog.getByRole('radio', { name: 'A new shortlist' }).isChecked()).toBe(true);
    await dialog.getByRole('button', { name: 'Add to shortlist' }).click();
    await dialog.getByText('Give the shortlist a name').waitFor();
    await dialog.getByLabel('Shortlist name').fill(SHORTLIST);
    await dialog.getByLabel('Note').fill('Best margin in the table; confirm lot test certificates with the supplier.');
    await dialog.getByRole('button', { name: 'Add to shortlist' }).click();
    await page.getByTestId('shortlist-notice').getByText('(1 candidate)').waitFor();

    // Second candidate: the shortlist just made is offered first.
    await shortlistButtons.nth(1).click();
    dialog = page.getByRole('dialog', { name: 'Add to a shortlist' });
    const existing = dialog.getByRole('radio', { name: new RegExp(SHORTLIST) });
    await existing.waitFor();
    expect(await existing.isChecked()).toBe(true);
    await dialog.getByLabel('Note').fill('Fallback; confirm creep data at 25 °C and the lead time for 100 mm blanks.');
    await dialog.getByRole('button', { name: 'Add to shortlist' }).click();
    await page.getByTestId('shortlist-notice').getByText('(2 candidates)').waitFor();

    await page.getByRole('link', { name: 'Open the shortlist' }).click();
    await page.waitForURL(/\/shortlists\/\d+$/);
    shortlistUrl = page.url();
    await page.getByRole('heading', { name: SHORTLIST }).waitFor();
    expect(await page.getByTestId('shortlist-item').count()).toBe(2);
  });

  it('reorders with the keyboard-reachable buttons, compares side by side and submits the shortlist', async () => {
    const { page } = s;
    const notes = page.getByTestId('item-note');
    expect(await notes.first().textContent()).toMatch(/^Best margin/);
    const down = page.getByRole('button', { name: /^Move .+ down$/ }).first();
    await down.focus();
    await page.keyboard.press('Enter');
    await expect.poll(async () => notes.first().textContent()).toMatch(/^Fallback/);

    const compare = page.getByRole('table', { name: 'Candidates side by side' });
    await compare.waitFor();
    const text = (await compare.textContent()) ?? '';
    for (const row of ['Density', "Young's modulus", 'Governing mode', 'Safety factor', 'Margin', 'Required thickness', 'Mass per area', 'Warnings']) {
      expect(text).toContain(row);
    }

    await page.getByRole('button', { name: 'Submit for checking…' }).click();
    const dialog = page.getByRole('dialog', { name: `Submit “${SHORTLIST}” for checking?` });
    await dialog.getByRole('button', { name: 'Submit for checking' }).click();
    await expect.poll(async () => page.getByTestId('shortlist-status').textContent()).toMatch(/Submitted by/);
    // The author cannot check their own work.
    expect(await page.getByTestId('second-engineer').textContent()).toMatch(/second engineer must check it/);
    expect(await page.getByRole('button', { name: 'Check…' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /^Move / }).count()).toBe(0);
    // What the checker will review is what was submitted, and the page says so.
    expect(await page.getByTestId('frozen-inputs').textContent()).toMatch(/those submitted on/);
    expect(await page.getByTestId('rounds').textContent()).toMatch(/Round 1: submitted by .*Waiting for a check\./);
  });

  it('lets the demo checker, a member of the project, check it and freeze the design record', async () => {
    const { page } = s;
    await signInAs(page, 'checker');
    await page.goto(shortlistUrl);
    await page.getByRole('button', { name: 'Check…' }).click();
    const dialog = page.getByRole('dialog', { name: `Check “${SHORTLIST}”?` });
    await dialog.getByLabel('Comment (optional)').fill('Agreed; confirm the seat geometry against the standard tables.');
    await dialog.getByRole('button', { name: 'Check and freeze the record' }).click();
    await expect.poll(async () => page.getByTestId('shortlist-status').textContent()).toMatch(new RegExp(`Checked by ${nameOf('checker')}`));
    await page.getByRole('link', { name: 'Open the design record' }).waitFor();
  });

  it('shows the engineer the printable design record and downloads its PDF', async () => {
    const { page } = s;
    await signInAs(page, 'engineer');
    await page.goto(shortlistUrl);
    await page.getByRole('link', { name: 'Open the design record' }).click();
    await page.waitForURL(/\/records\/\d+$/);
    expect(await page.getByTestId('record-author').textContent()).toBe(nameOf('engineer'));
    expect(await page.getByTestId('record-checker').textContent()).toBe(nameOf('checker'));
    expect(await page.getByTestId('rounds').textContent()).toMatch(new RegExp(`Checked by ${nameOf('checker')} on .*: “Agreed; confirm the seat geometry`));
    await page.getByRole('complementary', { name: 'Cautions' }).waitFor();
    expect(await page.getByRole('table', { name: 'Shortlisted candidates' }).locator('tbody tr').count()).toBe(2);
    await page.getByRole('img', { name: 'Margins by failure mode per candidate' }).waitFor();
    expect(await page.getByRole('list', { name: 'Data sources' }).textContent()).toMatch(/Property set #\d+, version \d+/);
    // The record shows what set each thickness; the PVHO-grade acrylic at the top was sized by the Stachiw cone table.
    const sizing = (await page.getByTestId('sizing-summary').allTextContents()).join(' ');
    expect(sizing).toMatch(/Thickness set by: rating table: Conical acrylic windows 90-150°/);
    expect(sizing).toMatch(/Journal of Engineering for Industry/);
    await page.getByRole('button', { name: 'Print' }).waitFor();

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^isobath-design-record-\d+\.pdf$/);
    const file = await readFile((await download.path())!);
    expect(file.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('asks to save an unsaved load case before shortlisting from it, then offers the shortlist', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/evaluate`);
    await page.getByRole('table', { name: 'Ranked candidates' }).waitFor();
    // A thinner trial window: a different load case from the one saved earlier.
    await page.getByLabel(/^Thickness/).fill('90');
    await page.getByRole('button', { name: 'Evaluate candidates' }).click();
    await page.getByRole('button', { name: /^Add .+ to a shortlist$/ }).first().click();
    const save = page.getByRole('dialog', { name: 'Save the load case to a project' });
    await save.getByText('A shortlist belongs to a saved load case').waitFor();
    await save.getByLabel('Project').selectOption({ label: PROJECT });
    await save.getByLabel('Name').fill('Forward viewport, 90 mm trial');
    await save.getByRole('button', { name: 'Save load case' }).click();
    await page.waitForURL(/\/evaluate\?loadCase=\d+$/);
    // The shortlist dialog opens by itself; no shortlist of this new load case exists yet.
    const dialog = page.getByRole('dialog', { name: 'Add to a shortlist' });
    await dialog.getByText('for the load case “Forward viewport, 90 mm trial”').waitFor();
    await dialog.getByRole('radio', { name: 'A new shortlist' }).waitFor();
    expect(await dialog.getByRole('radio').count()).toBe(1);
    expect(await page.getByLabel(/^Thickness/).inputValue()).toBe('90');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
  });

  it('shows a field error on the account page when the current password is wrong', async () => {
    const { page } = s;
    await page.getByTestId('signed-in-as').click();
    await page.waitForURL(/\/account$/);
    const form = page.getByRole('form', { name: 'Change your password' });
    await form.getByLabel('Current password').fill('not-the-password-at-all');
    await form.getByLabel('New password').fill('harrow-sound-new-2026');
    await form.getByLabel('Repeat it').fill('harrow-sound-new-2026');
    await form.getByRole('button', { name: 'Change password' }).click();
    await form.getByText('Current password is not right.').waitFor();
    expect(await form.getByLabel('Current password').getAttribute('aria-invalid')).toBe('true');
  });

  it('lists an invitation the admin sends as waiting', async () => {
    const { page } = s;
    await signInAs(page, 'admin');
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Admin' }).click();
    await page.getByRole('navigation', { name: 'Admin' }).getByRole('link', { name: 'Team' }).click();
    await page.waitForURL(/\/admin\/users$/);
    await page.getByRole('table', { name: 'People' }).getByText('engineer@harrow.example').waitFor();

    const form = page.getByRole('form', { name: 'Invite someone' });
    await form.getByLabel('E-mail').fill('not an address');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await form.getByText('Enter a valid e-mail address').waitFor();
    // An address that already has an account is refused on that field.
    await form.getByLabel('E-mail').fill('checker@harrow.example');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await form.getByText('That address already has an account').waitFor();

    await form.getByLabel('E-mail').fill('rhona.petrie@harrow.example');
    await form.getByLabel('Role').selectOption('checker');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    const row = page.getByRole('table', { name: 'Invitations' }).getByRole('row', { name: /rhona\.petrie@harrow\.example/ });
    await row.waitFor();
    expect(await row.textContent()).toMatch(/Checker.*waiting/);
  });

  it('offers a reset link from the sign-in page and answers the same whatever the address', async () => {
    const { page, baseUrl } = s;
    await s.context.clearCookies();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.waitForURL(/\/forgot-password$/);
    await page.getByLabel('E-mail').fill('nobody@harrow.example');
    await page.getByRole('button', { name: 'Send the link' }).click();
    expect(await page.getByTestId('reset-requested').textContent()).toMatch(/If nobody@harrow\.example belongs to an Isobath account/);
  });
});
