/// <reference lib="dom" />
// Confirming a value of a published set in chromium: the demo librarian proposes where the source
// shows it and may not approve it herself; a second librarian finds it in the desk's queue and
// approves it on the set's page; the set page, the material page and Evaluate's inputs mark then
// read it as confirmed without reloading the app; a reject needs a comment; a confirmation decided
// meanwhile shows as stale; the administrator's audit log shows the steps. Harrow Sound accounts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserSession, signInThroughForm, type BrowserSession, switchAccount } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { createAccount, EXTRA_PASSWORD } from '../helpers/library';
import { engineInputKeys, presentKeys, statusOf, PROVENANCE_LABELS, type ProvenanceKey, type ValueConfirmationDto } from '../../shared/schemas/provenance';
import type { PropertySetDto } from '../../shared/schemas/catalogue';

// The second librarian (invented, Harrow Sound scenario).
const SECOND = { email: 'kerensa.polglase@harrow.example', name: 'Kerensa Polglase' };
const LOCATION = 'Table 2, row 4';
const REJECT_LOCATION = 'p. 7, second column';
const STALE_LOCATION = 'Figure 3';

const esc = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

let s: BrowserSession;
/** The chosen published seed set, the engine input confirmed (approve), and two more values (reject, stale). */
let set: PropertySetDto;
let approveKey: ProvenanceKey;
let rejectKey: ProvenanceKey;
let staleKey: ProvenanceKey;

beforeAll(async () => {
  s = await startBrowserSession();
  await createAccount(SECOND.email, SECOND.name, 'librarian');
});
afterAll(async () => {
  await s?.close();
});

const signInAs = (page: Page, email: string, password: string) => switchAccount(s, page, email, password);

/** The "c/t" of a ranked candidate's inputs mark. */
async function markOf(page: Page, setId: number): Promise<[number, number]> {
  const row = page.getByRole('table', { name: 'Ranked candidates' }).locator('tbody tr', { has: page.locator(`a[href="/sets/${setId}"]`) });
  const text = await row.getByTestId('inputs-mark').textContent();
  const m = /^(\d+)\/(\d+)/.exec(text ?? '');
  if (!m) throw new Error(`no inputs mark for set ${setId}: ${text}`);
  return [Number(m[1]), Number(m[2])];
}

/** A script's session as the demo administrator (curl-like: JSON body, no Origin). */
async function adminFetch(path: string, body?: unknown): Promise<Response> {
  const login = await fetch(`${s.baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email: 'admin@harrow.example', password: DEMO_PASSWORD }) });
  expect(login.status).toBe(200);
  const cookie = login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  return fetch(`${s.baseUrl}${path}`, body === undefined ? { headers: { cookie } } : { method: 'POST', headers: { cookie, 'content-type': 'application/json' }, body: JSON.stringify(body) });
}

describe('value confirmations in chromium', () => {
  it('picks a ranked seed set with values not yet confirmed', async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.goto(`${baseUrl}/evaluate`);
    const table = page.getByRole('table', { name: 'Ranked candidates' });
    await table.waitFor();
    const ids = [...new Set((await table.locator('a[href^="/sets/"]').evaluateAll((as) => as.map((a) => Number(a.getAttribute('href')!.split('/')[2])))))];
    expect(ids.length).toBeGreaterThan(3);
    for (const id of ids) {
      const res = await page.request.get(`${baseUrl}/api/property-sets/${id}`);
      expect(res.status()).toBe(200);
      const candidate = (await res.json()) as PropertySetDto;
      const engineOpen = engineInputKeys(candidate).filter((k) => statusOf(candidate.provenance, k) !== 'confirmed');
      const open = presentKeys(candidate).filter((k) => statusOf(candidate.provenance, k) !== 'confirmed');
      if (engineOpen.length === 0 || open.length < 3) continue;
      set = candidate;
      approveKey = engineOpen[0];
      [rejectKey, staleKey] = open.filter((k) => k !== approveKey);
      break;
    }
    // The seed catalogue is partly confirmed (data/README.md), so a ranked set has open values.
    expect(set, 'a ranked published set with three values not confirmed').toBeDefined();
    expect((await markOf(page, set.id))[0]).toBeLessThan((await markOf(page, set.id))[1]);
  });

  it('lets the demo librarian propose confirmations by keyboard and form, and refuses her approving her own', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/library/sets/${set.id}`);
    await page.getByRole('heading', { name: new RegExp(esc(set.material.name)) }).waitFor();
    expect(await page.getByTestId(`status-${approveKey}`).first().textContent()).not.toMatch(/^confirmed/);
    const panel = page.getByTestId('set-confirmations');
    await panel.getByText('No value of this set has been put up for confirmation').waitFor();

    // Keyboard: the action opens the form with the focus on the choice of value.
    await page.getByRole('button', { name: 'Confirm a value…' }).focus();
    await page.keyboard.press('Enter');
    const form = page.getByRole('form', { name: 'Confirm a value' });
    await form.waitFor();
    expect(await page.evaluate(() => (document.activeElement as HTMLSelectElement | null)?.tagName)).toBe('SELECT');

    // Nothing chosen, nothing typed: each field says what it needs, and nothing is sent.
    await form.getByRole('button', { name: 'Propose the confirmation' }).click();
    await form.getByText('Choose one of the set’s values.').waitFor();
    await form.getByText('Say where the source shows the value: table, page, figure or clause.').waitFor();

    const propose = async (key: ProvenanceKey, location: string) => {
      if (!(await form.isVisible())) await page.getByRole('button', { name: 'Confirm a value…' }).click();
      await form.getByLabel('Value').selectOption(key);
      // The option and the hint give the value's status now.
      expect(await form.getByText(/^The set gives .+; now (recalled, not confirmed|derived|demo data)\.$/).count()).toBe(1);
      await form.getByLabel('Where the source shows it').fill(location);
      await form.getByRole('button', { name: 'Propose the confirmation' }).click();
      await panel.getByText(`Proposed: ${PROVENANCE_LABELS[key].toLowerCase()} at “${location}”`, { exact: false }).waitFor();
      await page.getByTestId(`confirmation-${key}`).waitFor();
    };
    await propose(approveKey, LOCATION);
    await propose(rejectKey, REJECT_LOCATION);

    // A proposal for the same value sent meanwhile (by a script, as a colleague might): the
    // server's refusal shows on the form, and the list shows the one that came first.
    await page.getByRole('button', { name: 'Confirm a value…' }).click();
    await form.getByLabel('Value').selectOption(staleKey);
    await form.getByLabel('Where the source shows it').fill('Figure 4');
    const meanwhile = await page.request.post(`${baseUrl}/api/library/sets/${set.id}/confirmations`, { data: { key: staleKey, location: STALE_LOCATION } });
    expect(meanwhile.status()).toBe(201);
    await form.getByRole('button', { name: 'Propose the confirmation' }).click();
    await form.getByText('A confirmation of this value is already waiting for review.').waitFor();
    await expect.poll(() => page.getByTestId(`confirmation-${staleKey}`).textContent()).toContain(STALE_LOCATION);
    await form.getByRole('button', { name: 'Cancel' }).click();

    const row = page.getByTestId(`confirmation-${approveKey}`);
    expect(await row.textContent()).toMatch(new RegExp(`${LOCATION}.*Tamsin Oyelaran \\(you\\).*proposed`));
    // Four-eyes: the buttons are there, off, with the reason.
    expect(await row.getByRole('button', { name: 'Approve…' }).isDisabled()).toBe(true);
    expect(await row.getByRole('button', { name: 'Reject…' }).isDisabled()).toBe(true);
    expect(await row.getByTestId('confirmation-four-eyes').textContent()).toBe(
      'You proposed this confirmation, so someone else must approve or reject it (four-eyes rule).',
    );
    // A value with a proposal waiting is not offered again.
    await page.getByRole('button', { name: 'Confirm a value…' }).click();
    expect(await form.getByRole('option', { name: `${PROVENANCE_LABELS[approveKey]} — a confirmation waits for review`, exact: true }).isDisabled()).toBe(true);
    await form.getByRole('button', { name: 'Cancel' }).click();

    // The desk's queue lists them, marked as hers.
    await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link', { name: 'Library desk' }).click();
    const queue = page.getByRole('table', { name: 'Values waiting for confirmation review' });
    await queue.waitFor();
    const mine = queue.locator('tbody tr', { hasText: PROVENANCE_LABELS[approveKey] }).filter({ hasText: LOCATION });
    expect(await mine.textContent()).toMatch(/Tamsin Oyelaran\s*yours/);
  });

  it('lets a second librarian approve from the queue; the set, material and Evaluate pages then read it confirmed without a reload', async () => {
    const { page, baseUrl } = s;
    await signInAs(page, SECOND.email, EXTRA_PASSWORD);
    // Evaluate and the material page are read (and cached) before the approval.
    await page.goto(`${baseUrl}/evaluate`);
    await page.getByRole('table', { name: 'Ranked candidates' }).waitFor();
    const [confirmed, total] = await markOf(page, set.id);
    await page.getByRole('table', { name: 'Ranked candidates' }).locator(`a[href="/sets/${set.id}"]`).first().click();
    await page.waitForURL(new RegExp(`/materials/${set.material.id}\\?set=${set.id}$`));
    expect(await page.getByTestId(`status-${approveKey}`).first().textContent()).not.toMatch(/^confirmed/);

    // From here on only the app's own links: no page load refreshes anything.
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Library desk' }).click();
    const queue = page.getByRole('table', { name: 'Values waiting for confirmation review' });
    await queue.waitFor();
    const row = queue.locator('tbody tr', { hasText: PROVENANCE_LABELS[approveKey] }).filter({ hasText: LOCATION });
    expect(await row.textContent()).toContain('Tamsin Oyelaran');
    expect(await row.textContent()).not.toContain('yours');
    await row.getByRole('link').click();
    await page.waitForURL(new RegExp(`/library/sets/${set.id}$`));

    const entry = page.getByTestId(`confirmation-${approveKey}`);
    await entry.getByRole('button', { name: 'Approve…' }).click();
    const dialog = page.getByRole('dialog', { name: `Approve the confirmation: ${PROVENANCE_LABELS[approveKey]}?` });
    await dialog.waitFor();
    expect(await dialog.textContent()).toContain(`“${LOCATION}”`);
    // Escape leaves it as it was.
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    await entry.getByRole('button', { name: 'Approve…' }).click();
    await dialog.getByRole('button', { name: 'Approve the confirmation' }).click();
    await page.getByText(`${PROVENANCE_LABELS[approveKey]} now reads as confirmed at “${LOCATION}”`, { exact: false }).waitFor();
    await expect.poll(() => entry.textContent()).toMatch(new RegExp(`approved\\s*by ${SECOND.name}`));
    expect(await entry.getByRole('button').count()).toBe(0);
    const status = page.getByTestId(`status-${approveKey}`).first();
    await expect.poll(() => status.textContent()).toBe(`confirmed — ${LOCATION}`);

    await page.getByRole('link', { name: 'Open in the catalogue' }).click();
    await page.waitForURL(new RegExp(`/materials/${set.material.id}\\?set=${set.id}$`));
    await expect.poll(() => page.getByTestId(`status-${approveKey}`).first().textContent()).toBe(`confirmed — ${LOCATION}`);

    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Evaluate' }).click();
    await page.getByRole('table', { name: 'Ranked candidates' }).waitFor();
    await expect.poll(() => markOf(page, set.id)).toEqual([confirmed + 1, total]);
  });

  it('asks for a comment to reject, and shows a confirmation decided meanwhile as stale', async () => {
    const { page } = s;
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Library desk' }).click();
    await page.getByRole('table', { name: 'Values waiting for confirmation review' }).locator('tbody tr', { hasText: REJECT_LOCATION }).getByRole('link').click();
    await page.waitForURL(new RegExp(`/library/sets/${set.id}$`));

    const rejected = page.getByTestId(`confirmation-${rejectKey}`);
    await rejected.getByRole('button', { name: 'Reject…' }).click();
    const dialog = page.getByRole('dialog', { name: `Reject the confirmation: ${PROVENANCE_LABELS[rejectKey]}?` });
    await dialog.getByRole('button', { name: 'Reject the confirmation' }).click();
    await dialog.getByText('Say what the author must change.').waitFor();
    await dialog.getByLabel('Comment for the author').fill('Page 7 gives the resin, not the finished sheet.');
    await dialog.getByRole('button', { name: 'Reject the confirmation' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(() => rejected.textContent()).toMatch(new RegExp(`rejected\\s*by ${SECOND.name}.*“Page 7 gives the resin, not the finished sheet\\.”`));

    // The administrator rejects the third proposal by script while this page still shows it open.
    const list = (await (await adminFetch(`/api/library/confirmations?propertySetId=${set.id}&status=proposed`)).json()) as { items: ValueConfirmationDto[] };
    const open = list.items.find((c) => c.key === staleKey)!;
    const behind = await adminFetch(`/api/library/confirmations/${open.id}/steps`, { step: 'reject', lockVersion: open.lockVersion, comment: 'Figure 3 shows a different lot.' });
    expect(behind.status).toBe(200);

    const stale = page.getByTestId(`confirmation-${staleKey}`);
    await stale.getByRole('button', { name: 'Approve…' }).click();
    const approve = page.getByRole('dialog', { name: `Approve the confirmation: ${PROVENANCE_LABELS[staleKey]}?` });
    await approve.getByRole('button', { name: 'Approve the confirmation' }).click();
    const banner = approve.getByTestId('step-stale');
    await banner.waitFor();
    expect(await banner.textContent()).toContain('Someone saved this value confirmation after you opened it.');
    await banner.getByRole('button', { name: 'Reload to see the change' }).click();
    await approve.waitFor({ state: 'hidden' });
    await expect.poll(() => stale.textContent()).toMatch(/rejected\s*by Morven Tait \(admin\)/);
    expect(await stale.textContent()).toContain('Figure 3 shows a different lot.');
    // The rejected value is offered again, the approved one no more.
    await page.getByRole('button', { name: 'Confirm a value…' }).click();
    const options = await page.getByRole('form', { name: 'Confirm a value' }).getByLabel('Value').locator('option').allTextContents();
    expect(options.some((o) => o.startsWith(`${PROVENANCE_LABELS[staleKey]} — `))).toBe(true);
    expect(options.some((o) => o.startsWith(`${PROVENANCE_LABELS[approveKey]} — `))).toBe(false);
    await page.getByRole('button', { name: 'Cancel' }).click();
  });

  it('fits a 390 px screen: the set page scrolls no wider than the screen', async () => {
    const { page, baseUrl } = s;
    await page.setViewportSize({ width: 390, height: 900 });
    await page.goto(`${baseUrl}/library/sets/${set.id}`);
    await page.getByTestId(`confirmation-${approveKey}`).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.goto(`${baseUrl}/library`);
    await page.getByRole('heading', { name: 'Library desk' }).waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await page.setViewportSize({ width: 1400, height: 900 });
  });

  it('shows the proposal, the approval and the value confirmed on the set in the administrator’s audit log', async () => {
    const { page, baseUrl } = s;
    await signInAs(page, 'admin@harrow.example', DEMO_PASSWORD);
    const list = (await (await adminFetch(`/api/library/confirmations?propertySetId=${set.id}&status=approved`)).json()) as { items: ValueConfirmationDto[] };
    expect(list.items.map((c) => c.key)).toEqual([approveKey]);
    await page.goto(`${baseUrl}/admin/audit?entityType=value-confirmation&entityId=${list.items[0].id}`);
    const entries = page.getByRole('table', { name: 'Audit entries' });
    await entries.waitFor();
    const rows = await entries.locator('tbody tr').allTextContents();
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatch(new RegExp(`${SECOND.name}\\s*approve\\s*Value confirmation #${list.items[0].id}`));
    expect(rows[1]).toMatch(new RegExp(`Tamsin Oyelaran\\s*propose\\s*Value confirmation #${list.items[0].id}`));

    await page.goto(`${baseUrl}/admin/audit?entityType=property-set&entityId=${set.id}`);
    const onSet = entries.locator('tbody tr', { hasText: 'confirm-value' });
    await onSet.waitFor();
    expect(await onSet.textContent()).toContain(SECOND.name);
    await onSet.getByRole('button', { name: /Before \/ after/ }).click();
    expect(await entries.locator('pre').last().textContent()).toContain(LOCATION);
  });
});
