/// <reference lib="dom" />
// The one form pattern in chromium: field errors from the shared schemas before anything is sent,
// the server's refusals on the form, and the one stale-write banner. Harrow Sound demo data only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';
import { DEMO_CHAMBER_PORT } from '../../shared/demo-load-cases';

const TITLE = 'Harrow Sound port blank creep tests, lot 14';
// The shape of a mailed token (43 base64url characters), but never issued.
const UNISSUED_TOKEN = 'Zq3Xw8Lm2Nb7Vc1Kd9Hs4Jf6Gt0Pr5Ye2Ua8Io3Wm7Q';

let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
});
afterAll(async () => {
  await s?.close();
});

describe('forms in chromium', () => {
  it('names the missing fields of a new reference, and keeps a librarian’s edits when someone else saved it first', async () => {
    const { page, baseUrl, context } = s;
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.goto(`${baseUrl}/library/references`);
    await page.getByRole('button', { name: 'New reference' }).first().click();
    const form = page.getByRole('form', { name: 'New reference' });
    await form.getByRole('button', { name: 'Create reference' }).click();
    await form.getByText('Choose one of the options').waitFor();
    expect(await form.getByLabel('Title').getAttribute('aria-invalid')).toBe('true');

    await form.getByLabel('Kind').selectOption('test-report');
    await form.getByLabel('Title').fill(TITLE);
    await form.getByLabel('Year').fill('2025');
    await form.getByRole('button', { name: 'Create reference' }).click();
    await page.getByText('Reference created. You can attach its document now.').waitFor();

    // A second librarian's tab saves the same reference first.
    const other = await context.newPage();
    await other.goto(`${baseUrl}/library/references`);
    await other.getByRole('button', { name: `Edit ${TITLE}` }).click();
    const otherForm = other.getByRole('form', { name: 'Edit reference' });
    await otherForm.getByLabel('Table or page').fill('Table 3');
    await otherForm.getByRole('button', { name: 'Save reference' }).click();
    await other.getByText('Reference saved.').waitFor();
    await other.close();

    const edit = page.getByRole('form', { name: 'Edit reference' });
    await edit.getByLabel('Note').fill('Creep at 20 °C over 1,000 h');
    await edit.getByRole('button', { name: 'Save reference' }).click();
    const banner = edit.getByRole('alert').filter({ hasText: 'Your edits are still in the form' });
    await banner.waitFor();
    expect(await banner.textContent()).toMatch(/Someone saved this reference after you opened it/);
    expect(await edit.getByLabel('Note').inputValue()).toBe('Creep at 20 °C over 1,000 h');

    await banner.getByRole('button', { name: /Load the saved version/ }).click();
    await expect.poll(() => page.getByRole('form', { name: 'Edit reference' }).getByLabel('Table or page').inputValue()).toBe('Table 3');
    expect(await page.getByRole('form', { name: 'Edit reference' }).getByLabel('Note').inputValue()).toBe('');
  });

  it('checks a new password typed twice before sending it, and says when the link is not valid', async () => {
    const { page, baseUrl, context } = s;
    await context.clearCookies();
    await page.goto(`${baseUrl}/reset-password?token=${UNISSUED_TOKEN}`);
    const form = page.getByRole('form', { name: 'Choose a new password' });
    await form.getByLabel('New password').fill('too-short');
    await form.getByLabel('Repeat it').fill('too-short');
    await form.getByRole('button', { name: 'Save the new password' }).click();
    await form.getByText('Use at least 12 characters').waitFor();

    await form.getByLabel('New password').fill('harrow-tide-table-2026');
    await form.getByLabel('Repeat it').fill('harrow-tide-table-2025');
    await form.getByRole('button', { name: 'Save the new password' }).click();
    await form.getByText('The two new passwords differ; type the same one twice.').waitFor();

    await form.getByLabel('Repeat it').fill('harrow-tide-table-2026');
    await form.getByRole('button', { name: 'Save the new password' }).click();
    await form.getByText('This link is invalid, already used or expired. Ask for a new one.').waitFor();
    expect(await form.getByRole('link', { name: 'Ask for a new link' }).isVisible()).toBe(true);
  });

  it('asks an invited colleague for a name before sending the invitation answer', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/welcome?token=${UNISSUED_TOKEN}`);
    const form = page.getByRole('form', { name: 'Accept the invitation' });
    await form.getByLabel('Password', { exact: true }).fill('harrow-sounding-line-7');
    await form.getByLabel('Repeat it').fill('harrow-sounding-line-7');
    await form.getByRole('button', { name: 'Set up my account' }).click();
    await form.getByText('Enter your name').waitFor();

    await form.getByLabel('Your name').fill('Morag Linklater');
    await form.getByRole('button', { name: 'Set up my account' }).click();
    await form.getByText('This link is invalid, already used or expired. Ask for a new one.').waitFor();
    expect(await form.getByRole('link', { name: 'Sign in' }).isVisible()).toBe(true);
  });

  it('keeps an engineer’s changes to a saved load case someone else changed first, and reopens it as saved', async () => {
    const { page, baseUrl, context } = s;
    await context.clearCookies();
    await signInThroughForm(page, baseUrl, 'engineer');
    const project = (await (await page.request.post(`${baseUrl}/api/projects`, { data: { name: 'TC-7 chamber ports', description: 'Harrow Sound treatment chamber' } })).json()) as { id: number };
    const created = await page.request.post(`${baseUrl}/api/projects/${project.id}/load-cases`, { data: { name: 'Side port', loadCase: DEMO_CHAMBER_PORT } });
    expect(created.status()).toBe(201);
    const { id } = (await created.json()) as { id: number };
    await page.goto(`${baseUrl}/evaluate?loadCase=${id}`);
    await page.getByTestId('saved-load-case').getByText('Side port').waitFor();

    // Meanwhile the case is renamed elsewhere.
    const renamed = await page.request.put(`${baseUrl}/api/load-cases/${id}`, { data: { name: 'Side port, upper', loadCase: DEMO_CHAMBER_PORT, notes: '', lockVersion: 0 } });
    expect(renamed.status()).toBe(200);

    await page.getByRole('button', { name: 'Save to a project…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Save the load case to a project' });
    await dialog.getByRole('radio', { name: /Changes to “Side port”/ }).check();
    await dialog.getByLabel('Notes').fill('Seat drawing HS-TC7-04');
    await dialog.getByRole('button', { name: 'Save changes' }).click();
    const banner = dialog.getByRole('alert').filter({ hasText: 'Your edits are still in the form' });
    await banner.waitFor();
    expect(await dialog.getByLabel('Notes').inputValue()).toBe('Seat drawing HS-TC7-04');

    await banner.getByRole('button', { name: /Load the saved version/ }).click();
    await page.getByTestId('saved-load-case').getByText('Side port, upper').waitFor();
    expect(await dialog.isVisible()).toBe(false);
  });

  it('keeps an owner’s project edit when someone saved the project first, and loads the saved one on request', async () => {
    const { page, baseUrl, context } = s;
    await context.clearCookies();
    await signInThroughForm(page, baseUrl, 'engineer');
    const project = (await (await page.request.post(`${baseUrl}/api/projects`, { data: { name: 'HS-5 survey sled', description: 'Camera housing, 4,000 m' } })).json()) as { id: number };
    await page.goto(`${baseUrl}/projects/${project.id}`);
    await page.getByRole('button', { name: 'Edit name and description…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Edit the project' });
    // Another tab saves the project while this dialog is open.
    const other = await page.request.patch(`${baseUrl}/api/projects/${project.id}`, { data: { lockVersion: 0, description: 'Camera housing and lamp ports, 4,000 m' } });
    expect(other.status()).toBe(200);

    await dialog.getByLabel('Description').fill('Camera housing, 4,000 m; sapphire port under review');
    await dialog.getByRole('button', { name: 'Save' }).click();
    const banner = dialog.getByTestId('project-stale');
    await banner.waitFor();
    expect(await banner.textContent()).toMatch(/Someone saved this project after you opened it/);
    expect(await dialog.getByLabel('Description').inputValue()).toBe('Camera housing, 4,000 m; sapphire port under review');

    await banner.getByRole('button', { name: /Load the saved version/ }).click();
    await expect.poll(() => dialog.getByLabel('Description').inputValue()).toBe('Camera housing and lamp ports, 4,000 m');
    await dialog.getByLabel('Name').fill('HS-5 survey sled ports');
    await dialog.getByRole('button', { name: 'Save' }).click();
    await page.getByRole('heading', { name: 'HS-5 survey sled ports' }).waitFor();
    expect(await dialog.isVisible()).toBe(false);
  });

  it('keeps an author’s note when the note was saved elsewhere first, and loads the saved note on request', async () => {
    const { page, baseUrl, context } = s;
    await context.clearCookies();
    await signInThroughForm(page, baseUrl, 'engineer');
    const api = async (method: 'post' | 'patch', path: string, data: unknown) => {
      const res = await page.request[method](`${baseUrl}/api${path}`, { data });
      expect(res.status(), path).toBeLessThan(300);
      return res.json();
    };
    const project = await api('post', '/projects', { name: 'HS-6 chamber', description: 'Treatment chamber, 5 bar' });
    const lc = await api('post', `/projects/${project.id}/load-cases`, { name: 'Flat viewport', loadCase: DEMO_CHAMBER_PORT });
    const sl = await api('post', `/projects/${project.id}/shortlists`, { loadCaseId: lc.id, name: 'Chamber viewport material' });
    const set = ((await (await page.request.get(`${baseUrl}/api/property-sets?family=acrylic`)).json()) as { items: { id: number; material: { name: string } }[] }).items[0];
    const withItem = await api('post', `/shortlists/${sl.id}/items`, { propertySetId: set.id, note: 'First thoughts' });
    const item = withItem.items[0] as { id: number; lockVersion: number };

    await page.goto(`${baseUrl}/shortlists/${sl.id}`);
    await page.getByRole('button', { name: `Edit the note on ${set.material.name}` }).click();
    const editor = page.getByRole('form', { name: `Note on ${set.material.name}` });
    await api('patch', `/shortlists/${sl.id}/items/${item.id}`, { note: 'Ask for the lot certificate', lockVersion: item.lockVersion });

    await editor.getByLabel(/^Note/).fill('Check the bearing surface finish');
    await editor.getByRole('button', { name: 'Save note' }).click();
    const banner = editor.getByTestId('note-stale');
    await banner.waitFor();
    expect(await editor.getByLabel(/^Note/).inputValue()).toBe('Check the bearing surface finish');

    await banner.getByRole('button', { name: 'Load the saved note (discards your edit)' }).click();
    await expect.poll(() => editor.getByLabel(/^Note/).inputValue()).toBe('Ask for the lot certificate');
    await editor.getByLabel(/^Note/).fill('Ask for the lot certificate and the bearing surface finish');
    await editor.getByRole('button', { name: 'Save note' }).click();
    await page.getByTestId('item-note').filter({ hasText: 'Ask for the lot certificate and the bearing surface finish' }).waitFor();
  });
});
