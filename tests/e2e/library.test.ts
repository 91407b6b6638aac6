/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserSession, signInThroughForm, type BrowserSession, switchAccount } from '../helpers/browser';
import { Material, User } from '../../server/db/models';
import { hashPassword } from '../../server/auth/passwords';
import { IMPORT_COLUMNS } from '../../shared/schemas/library';

// A second librarian for the four-eyes step (invented, Harrow Sound scenario).
const SECOND = { email: 'second.librarian@harrow.example', name: 'Ines Marrack', password: 'harrow-second-2026' };
// What the demo librarian drafts: an invented lot of cast acrylic with its own test report.
const CONDITION = 'Cast sheet, annealed, Harrow lot 7';
const REFERENCE_TITLE = 'Harrow Sound viewport blank tests, lot 7';

let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
  await User.create({ email: SECOND.email, name: SECOND.name, role: 'librarian', passwordHash: await hashPassword(SECOND.password), lastLoginAt: null });
});
afterAll(async () => {
  await s?.close();
});

async function signOut(page: Page) {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.waitForURL(/\/sign-in/);
}

const signInAs = (page: Page, email: string, password: string) => switchAccount(s, page, email, password);

describe('library desk journey in chromium', () => {
  it('lets the demo librarian draft a set with a new reference and submit it, but not approve it', async () => {
    const { page, baseUrl } = s;
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Library desk' }).click();
    await page.waitForURL(/\/library$/);
    await page.getByRole('heading', { name: 'Library desk' }).waitFor();
    await page.getByRole('link', { name: 'New property set' }).first().click();
    await page.waitForURL(/\/library\/sets\/new$/);

    // Submitting an empty form names the missing fields instead of sending it.
    await page.getByRole('button', { name: 'Submit for review…' }).click();
    expect(await page.getByText('Choose a material, or describe a new one').isVisible()).toBe(true);
    expect(await page.getByRole('dialog').isVisible()).toBe(false);

    await page.getByLabel('Material', { exact: true }).selectOption({ label: 'Cast acrylic (PMMA)' });
    await page.getByLabel('Condition').fill(CONDITION);
    await page.getByRole('radio', { name: 'New reference' }).check();
    await page.getByLabel('Kind').selectOption('test-report');
    await page.getByLabel('Title').fill(REFERENCE_TITLE);
    await page.getByLabel('Authors or issuer').fill('Harrow Sound Marine Works');
    await page.getByLabel('Year').fill('2026');
    await page.getByLabel('Identifier').fill('HSMW-TR-031');

    const values: [string, string][] = [
      ['Density', '1190'],
      ["Young's modulus", '3.2'],
      ["Poisson's ratio", '0.37'],
      ['Tensile strength', '70'],
      ['Compressive strength', '120'],
      ['Shear strength', '60'],
    ];
    for (const [label, value] of values) await page.getByLabel(label, { exact: true }).fill(value);
    await page.getByLabel('Basis of tensile strength').selectOption('minimum');
    await page.getByLabel('Test method of tensile strength').fill('ASTM D638');
    await page.getByLabel(/Service temperature from/).fill('-10');
    await page.getByLabel(/Service temperature to/).fill('50');
    await page.getByRole('button', { name: '+ Add point' }).first().click();
    await page.getByLabel(/Temperature \(°C\), point 1/).fill('23');
    await page.getByLabel('Strength factor, point 1').first().fill('1');

    const submit = page.getByRole('button', { name: 'Submit for review…' });
    const dialog = page.getByRole('dialog', { name: 'Submit for review?' });
    // Escape closes the confirmation without doing anything and gives the focus back.
    await submit.click();
    await dialog.waitFor();
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    expect(await submit.evaluate((el) => el === document.activeElement)).toBe(true);
    expect(page.url()).toMatch(/\/library\/sets\/new$/);
    await submit.click();
    await dialog.waitFor();
    await dialog.getByRole('button', { name: 'Save and submit' }).click();
    await page.waitForURL(/\/library\/sets\/\d+$/);
    await page.getByRole('heading', { name: /Cast acrylic \(PMMA\)/ }).waitFor();
    await page.getByText('in review', { exact: true }).first().waitFor();

    // Four-eyes: the author sees why the buttons are off.
    expect(await page.getByTestId('four-eyes').textContent()).toMatch(/second librarian/);
    expect(await page.getByRole('button', { name: 'Approve…' }).isDisabled()).toBe(true);
    expect(await page.getByRole('button', { name: 'Return to author…' }).isDisabled()).toBe(true);
    // The values were saved in SI and come back in the units on screen.
    expect(await page.getByRole('table', { name: 'Values' }).textContent()).toContain('70.0 MPa');
    expect(await page.getByTestId('set-reference').textContent()).toContain(REFERENCE_TITLE);

    await page.goto(`${baseUrl}/library`);
    expect(await page.getByRole('table', { name: 'Yours, waiting for review' }).textContent()).toContain(CONDITION);
    await signOut(page);
  });

  it('shows it in a second librarian’s review queue, who approves it', async () => {
    const { page, baseUrl } = s;
    await signInAs(page, SECOND.email, SECOND.password);
    await page.goto(`${baseUrl}/library`);
    const queue = page.getByRole('table', { name: 'Review queue' });
    await queue.waitFor();
    const row = queue.locator('tbody tr', { hasText: CONDITION });
    expect(await row.textContent()).toContain('Tamsin Oyelaran');
    await row.getByRole('link').click();
    await page.waitForURL(/\/library\/sets\/\d+$/);

    await page.getByRole('button', { name: 'Approve…' }).click();
    const dialog = page.getByRole('dialog', { name: 'Approve and publish?' });
    await dialog.waitFor();
    // The modal holds the focus (Cancel first, so Enter does not publish by accident).
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe('Cancel');
    await dialog.getByRole('button', { name: 'Approve and publish' }).click();
    await page.getByText('Approved and published', { exact: false }).waitFor();
    await page.getByText('published', { exact: true }).first().waitFor();
    expect(await page.getByTestId('set-history').textContent()).toContain(`Approved by${SECOND.name}`);
    await signOut(page);
  });

  it('lets the demo engineer find the published set in the catalogue, with its reference', async () => {
    const { page, baseUrl } = s;
    await s.context.clearCookies();
    await signInThroughForm(page, baseUrl, 'engineer');
    // Engineers have no library desk.
    expect(await page.getByRole('navigation', { name: 'Sections' }).getByRole('link', { name: 'Library desk' }).count()).toBe(0);
    await page.goto(`${baseUrl}/catalogue`);
    await page.getByLabel('Search').fill('Harrow lot 7');
    const rows = page.getByRole('table', { name: 'Property sets' }).locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().textContent()).toContain(CONDITION);
    await rows.first().getByRole('link').click();
    await page.waitForURL(/\/materials\/\d+\?set=\d+/);
    const reference = page.getByTestId('reference');
    await reference.waitFor();
    expect(await reference.textContent()).toContain(REFERENCE_TITLE);
    expect(await reference.textContent()).toContain('HSMW-TR-031');
    await signOut(page);
  });

  it('shows row-level errors for a bad CSV file and keeps Import all disabled', async () => {
    const { page, baseUrl } = s;
    await s.context.clearCookies();
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.goto(`${baseUrl}/library/import`);
    expect(await page.getByRole('link', { name: 'Download the template (CSV)' }).getAttribute('href')).toBe('/api/library/import/template.csv');

    const header = IMPORT_COLUMNS.map((c) => c.name);
    const row = (overrides: Record<string, string>) => {
      const base: Record<string, string> = {
        material: 'Cast acrylic (PMMA)',
        family: 'acrylic',
        transparent: 'yes',
        condition: 'Cast sheet, Harrow lot 8',
        reference_title: 'Harrow Sound viewport blank tests, lot 8',
        reference_kind: 'test-report',
        basis: 'minimum',
        density_kg_m3: '1190',
        youngs_modulus_gpa: '3.2',
        poissons_ratio: '0.37',
        tensile_strength_mpa: '70',
        compressive_strength_mpa: '120',
        shear_strength_mpa: '60',
        service_temp_min_c: '-10',
        service_temp_max_c: '50',
      };
      const cells = { ...base, ...overrides };
      return header.map((h) => `"${(cells[h] ?? '').replace(/"/g, '""')}"`).join(',');
    };
    const csv = [header.join(','), row({}), row({ tensile_strength_mpa: 'seventy' }), row({ family: 'unobtainium' })].join('\n') + '\n';
    await page.getByLabel('CSV file').setInputFiles({ name: 'harrow-lot-8.csv', mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });

    const issues = page.getByRole('table', { name: 'Row issues' });
    await issues.waitFor();
    const text = await issues.textContent();
    expect(text).toContain('tensile_strength_mpa');
    expect(text).toContain('family');
    expect(await page.getByTestId('import-summary').textContent()).toMatch(/Rows\s*3\s*Valid\s*1\s*Issues\s*2/);
    expect(await page.getByRole('button', { name: /Import all/ }).isDisabled()).toBe(true);

    // A file that is not CSV at all is refused with a message, not a table.
    await page.getByLabel('CSV file').setInputFiles({ name: 'notes.csv', mimeType: 'text/csv', buffer: Buffer.from([0x00, 0x01, 0x02, 0xff, 0xfe]) });
    expect(await page.getByTestId('import-refused').textContent()).toMatch(/cannot be imported/);
  });

  it('lists each value’s own columns on the import page, and previews the template’s rows as demo data with their statuses', async () => {
    const { page, baseUrl } = s;
    await s.context.clearCookies();
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.goto(`${baseUrl}/library/import`);

    const rowColumns = page.getByRole('table', { name: 'Template columns' });
    const own = page.getByRole('table', { name: 'Columns of one value' });
    await own.waitFor();
    for (const name of ['status', 'status_location', 'test_method', 'test_temperature_c', 'temperature_factors', 'cyclic_factors']) {
      expect(await rowColumns.getByRole('rowheader', { name: new RegExp(`^${name}\\b`) }).count(), name).toBe(1);
    }
    for (const suffix of ['basis', 'test_method', 'test_temperature_c', 'status', 'location', 'source', 'rule']) {
      expect(await own.getByRole('rowheader', { name: new RegExp(`^<value>_${suffix}\\b`) }).count(), suffix).toBe(1);
    }
    const ownText = (await own.textContent()) ?? '';
    for (const stem of ['tensile_strength', 'shear_yield', 'service_temperature', 'sustained_load_factors']) expect(ownText).toContain(stem);

    // The template the page links to, checked as it is: two rows, both demo data, none confirmed.
    const template = await page.request.get(`${baseUrl}/api/library/import/template.csv`);
    expect(template.status()).toBe(200);
    await page.getByLabel('CSV file').setInputFiles({ name: 'template.csv', mimeType: 'text/csv', buffer: Buffer.from(await template.text(), 'utf8') });
    await page.getByText('Every row is valid.').waitFor();
    const sample = page.getByRole('table', { name: 'Sample rows' });
    const cells = await sample.locator('tbody tr td:last-child').allTextContents();
    expect(cells).toEqual(['0 of 13demo data', '0 of 11demo data']);
  });

  it('shows the row issues of an import the server refused, when the catalogue changed after the check', async () => {
    const { page, baseUrl } = s;
    await s.context.clearCookies();
    await signInThroughForm(page, baseUrl, 'librarian');
    await page.goto(`${baseUrl}/library/import`);
    const cells: Record<string, string> = {
      material: 'Harrow Sound trial glass-ceramic HS-9',
      family: 'glass-ceramic',
      transparent: 'no',
      condition: 'Trial pressing, Harrow lot 9',
      reference_title: 'Harrow Sound trial pressing tests, lot 9',
      reference_kind: 'test-report',
      basis: 'typical',
      density_kg_m3: '2530',
      youngs_modulus_gpa: '92',
      poissons_ratio: '0.24',
      tensile_strength_mpa: '85',
      compressive_strength_mpa: '900',
      shear_strength_mpa: '70',
      service_temp_min_c: '-20',
      service_temp_max_c: '200',
    };
    const header = IMPORT_COLUMNS.map((c) => c.name);
    const csv = `${header.join(',')}\n${header.map((h) => `"${(cells[h] ?? '').replace(/"/g, '""')}"`).join(',')}\n`;
    await page.getByLabel('CSV file').setInputFiles({ name: 'harrow-lot-9.csv', mimeType: 'text/csv', buffer: Buffer.from(csv, 'utf8') });
    await page.getByText('Every row is valid.').waitFor();

    // Meanwhile someone records the same material name as another family.
    await Material.create({ name: 'Harrow Sound trial glass-ceramic HS-9', family: 'glass', transparent: false, description: null });
    await page.getByRole('button', { name: /Import all/ }).click();
    await page.getByRole('button', { name: 'Import 1 drafts' }).click();

    await page.getByText('The server refused the import; nothing was saved.').waitFor();
    const issues = page.getByRole('table', { name: 'Row issues' });
    const text = await issues.textContent();
    expect(text).toContain('family');
    expect(text).toMatch(/is glass in the catalogue/);
    expect(await page.getByTestId('import-done').count()).toBe(0);
  });

  it('keeps the librarian’s edits when someone else saved the draft first, and offers the saved version', async () => {
    const { page, baseUrl, context } = s;
    await context.clearCookies();
    await signInThroughForm(page, baseUrl, 'librarian');
    const materials = (await (await page.request.get(`${baseUrl}/api/materials`)).json()) as { items: { id: number; name: string }[] };
    const acrylic = materials.items.find((m) => m.name === 'Cast acrylic (PMMA)')!;
    const created = await page.request.post(`${baseUrl}/api/library/sets`, {
      data: {
        materialId: acrylic.id,
        condition: 'Cast sheet, Harrow lot 9',
        referenceId: null,
        density: 1190,
        youngsModulus: 3.2e9,
        poissonsRatio: 0.37,
        tensileStrength: 70e6,
        compressiveStrength: 120e6,
        shearStrength: 60e6,
        serviceTemperature: { min: -10, max: 50 },
      },
    });
    expect(created.status()).toBe(201);
    const { id } = (await created.json()) as { id: number };

    const other = await context.newPage();
    await Promise.all([page.goto(`${baseUrl}/library/sets/${id}`), other.goto(`${baseUrl}/library/sets/${id}`)]);
    await other.getByLabel('Condition').fill('Cast sheet, Harrow lot 9, re-annealed');
    await other.getByRole('button', { name: 'Save draft' }).click();
    await other.getByText(/Draft saved at/).waitFor();
    await other.close();

    await page.getByLabel('Shear strength', { exact: true }).fill('64');
    await page.getByRole('button', { name: 'Save draft' }).click();
    const banner = page.getByTestId('editor-banner');
    await banner.waitFor();
    expect(await banner.textContent()).toMatch(/Someone saved this set after you opened it/);
    expect(await page.getByLabel('Shear strength', { exact: true }).inputValue()).toBe('64');

    await banner.getByRole('button', { name: /Load the saved version/ }).click();
    await expect.poll(() => page.getByLabel('Condition').inputValue()).toBe('Cast sheet, Harrow lot 9, re-annealed');
    expect(await page.getByLabel('Shear strength', { exact: true }).inputValue()).toBe('60');
  });
});
