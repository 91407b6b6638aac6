/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';
import { pdfText } from '../helpers/pdf-text';
import { RECORD_SECTIONS } from '../../shared/labels';

// The demo seed's checked record of the 1,200 m submersible viewport (server/db/seeders/demo-project.ts).
const RECORD_ID = 1;

let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession({ demoProject: true });
  await signInThroughForm(s.page, s.baseUrl, 'engineer');
});
afterAll(async () => {
  await s?.close();
});

/** Text without its white space: pdfkit breaks lines after hyphens and slashes, the page elsewhere. */
const flat = (text: string) => text.replace(/\s+/g, '');

describe('The design record and its PDF in chromium', () => {
  for (const width of [1440, 390]) {
    it(`at ${width} px: the PDF has the page's sections in the same order, "n of N" on every page and no empty page`, async () => {
      const { page, baseUrl } = s;
      await page.setViewportSize({ width, height: 900 });
      await page.goto(`${baseUrl}/records/${RECORD_ID}`);
      await page.getByRole('heading', { name: RECORD_SECTIONS.models }).waitFor();
      const download = page.getByRole('link', { name: 'Download PDF' });
      expect(await download.isVisible()).toBe(true);

      // What the page shows: its section titles in order, each candidate, the design pressure and the sources' notes.
      const sections = await page.locator('.record-page h2').allTextContents();
      expect(sections).toEqual(Object.values(RECORD_SECTIONS));
      const candidates = (await page.locator('article[aria-label^="Candidate"] h3').allTextContents()).map((t) => t.replace(/^\d+\.\s*/, ''));
      expect(candidates.length).toBeGreaterThan(0);
      const facts = await page.getByTestId('load-case-facts').locator('dd').allTextContents();
      const factors = await page.locator('article[aria-label^="Candidate"] p', { hasText: 'Strength factors applied' }).allTextContents();
      expect(factors.length).toBe(candidates.length);
      const notes = await page.locator('[aria-label="Data sources"] p.whitespace-pre-line').allTextContents();

      const res = await page.request.get(`${baseUrl}${await download.getAttribute('href')}`);
      expect(res.status()).toBe(200);
      const pdf = await pdfText(Buffer.from(await res.body()));
      const pages = pdf.text.split('\n');
      expect(pages.length).toBe(pdf.pages);
      pages.forEach((text, i) => {
        expect(text).toContain(`page ${i + 1} of ${pdf.pages}`);
        // More on the page than its footer.
        expect(flat(text.replace(/Isobath design record .* see cautions/, '')).length).toBeGreaterThan(150);
      });

      const all = flat(pdf.text);
      let at = -1;
      for (const title of Object.values(RECORD_SECTIONS)) {
        const found = all.indexOf(flat(title), at + 1);
        expect(found, `section “${title}” after the one before it`).toBeGreaterThan(at);
        at = found;
      }
      for (const name of candidates) expect(all).toContain(flat(name));
      // The load case says the same in both (SI), the design pressure with it.
      expect(facts.some((f) => /MPa gauge/.test(f))).toBe(true);
      for (const fact of facts) expect(all).toContain(flat(fact));
      for (const f of factors) expect(all).toContain(flat(f));
      for (const note of notes) expect(all).toContain(flat(note).slice(0, 120));
      expect(all).toContain(flat('bars clipped at -100 % and +500 %'));
    });
  }

  it('a viewer sees why there is no PDF, and the server refuses it', async () => {
    const { page, baseUrl } = s;
    await page.setViewportSize({ width: 1440, height: 900 });
    await page.getByRole('button', { name: 'Sign out' }).click();
    await signInThroughForm(page, baseUrl, 'viewer');
    await page.goto(`${baseUrl}/records/${RECORD_ID}`);
    await page.getByRole('heading', { name: RECORD_SECTIONS.signOff }).waitFor();
    expect(await page.getByRole('link', { name: 'Download PDF' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Download PDF' }).isDisabled()).toBe(true);
    expect(await page.getByTestId('record-pdf-refusal').textContent()).toMatch(/cannot export|not export/);
    expect((await page.request.get(`${baseUrl}/api/records/${RECORD_ID}/pdf`)).status()).toBe(403);
  });
});
