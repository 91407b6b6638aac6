/// <reference lib="dom" />
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserSession, signInThroughForm, type BrowserSession } from '../helpers/browser';

// The Evaluate page as an engineer reads it on a desk screen (1440 px) and a phone (390 px), with
// the example load case: Harrow Sound's 1,200 m conical viewport (shared/demo-load-cases.ts).
let s: BrowserSession;
beforeAll(async () => {
  s = await startBrowserSession();
  await signInThroughForm(s.page, s.baseUrl, 'engineer');
});
afterAll(async () => {
  await s?.close();
});

async function openEvaluate(page: Page, width: number) {
  await page.setViewportSize({ width, height: 900 });
  await page.goto(`${s.baseUrl}/evaluate`);
  await page.getByTestId('evaluation-summary').waitFor();
}

/** Elements under `root` whose box sticks out of `root`'s box, or whose text is cut inside their own. */
async function clipped(page: Page, root: string, inner: string) {
  return page.evaluate(
    ([rootSel, innerSel]) => {
      const box = document.querySelector(rootSel)!.getBoundingClientRect();
      return [...document.querySelectorAll<HTMLElement>(`${rootSel} ${innerSel}`)]
        .filter((el) => {
          const r = el.getBoundingClientRect();
          return r.left < box.left - 1 || r.right > box.right + 1 || el.scrollWidth > el.clientWidth + 1;
        })
        .map((el) => el.textContent);
    },
    [root, inner] as const,
  );
}

describe('Evaluate at 1440 px and 390 px in chromium', () => {
  it('1440 px: the ranked table fits its box, every header whole, and the open modes show whole warnings', async () => {
    const { page } = s;
    await openEvaluate(page, 1440);
    const box = '[data-testid="ranked-table-box"]';
    const fits = await page.evaluate((sel) => {
      const el = document.querySelector(sel) as HTMLElement;
      return { client: el.clientWidth, scroll: el.scrollWidth };
    }, box);
    expect(fits.scroll).toBeLessThanOrEqual(fits.client);
    expect(await clipped(page, box, 'thead th')).toEqual([]);
    await page.getByRole('button', { name: /Show modes of/ }).first().click();
    const warnings = page.getByRole('list', { name: /^Warnings for/ }).first();
    await warnings.waitFor();
    expect(await warnings.locator('li').count()).toBeGreaterThan(0);
    expect(await clipped(page, box, '[data-testid="mode-breakdown"] li')).toEqual([]);
  });

  it('390 px: the ranking is a list of cards with every figure, nothing wider than the screen, warnings whole', async () => {
    const { page } = s;
    await openEvaluate(page, 390);
    const cards = page.getByTestId('result-card');
    await cards.first().waitFor();
    const first = (await cards.first().textContent()) ?? '';
    for (const label of ['Governed by', 'Safety factor / target', 'Margin', 'Required t', 'Mass', 'Warnings']) expect(first).toContain(label);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await cards.first().getByRole('button', { name: /Show modes of/ }).click();
    await page.getByRole('list', { name: /^Warnings for/ }).first().waitFor();
    expect(await clipped(page, 'main', '[data-testid="mode-breakdown"] li')).toEqual([]);
  });

  for (const width of [1440, 390]) {
    it(`${width} px: a changed form dims the ranking with “inputs changed — evaluate again”, invalid values never reach the sketch`, async () => {
      const { page } = s;
      await openEvaluate(page, width);
      const results = page.getByTestId('evaluation-results');
      expect(await results.getAttribute('data-stale')).toBe('false');
      expect(await page.getByTestId('stale-results').count()).toBe(0);

      await page.getByLabel(/^Thickness/).fill('80');
      await page.getByTestId('stale-results').waitFor();
      expect(await page.getByTestId('stale-results').textContent()).toContain('Inputs changed — evaluate again');
      expect(await results.getAttribute('data-stale')).toBe('true');

      await page.getByLabel(/^Thickness/).fill('-5');
      await page.getByLabel(/^Included angle/).fill('200');
      await expect.poll(async () => page.getByTestId('stale-results').textContent()).toMatch(/fix the marked fields/);
      const sketch = (await page.getByRole('img', { name: /^Sketch of the/ }).textContent()) ?? '';
      expect(sketch).not.toMatch(/NaN|-5|200/);
      expect(sketch).toContain('—');

      // Back to what was evaluated: the mark goes without evaluating again.
      await page.getByLabel(/^Thickness/).fill('100');
      await page.getByLabel(/^Included angle/).fill('90');
      await expect.poll(async () => page.getByTestId('stale-results').count()).toBe(0);

      // A real change, evaluated from the mark: the focus lands on the new summary.
      await page.getByLabel(/^Thickness/).fill('120');
      await page.getByRole('button', { name: 'Evaluate again' }).click();
      await expect.poll(async () => page.getByTestId('stale-results').count()).toBe(0);
      await expect.poll(async () => page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('evaluation-summary');
      expect(await page.getByRole('img', { name: /^Sketch of the/ }).textContent()).toContain('120.0 mm');
    });

    it(`${width} px: the mode map is computed in the browser in under 100 ms and a click loads its point into the form`, async () => {
      const { page } = s;
      await openEvaluate(page, width);
      const canvas = page.getByTestId('mode-map-canvas');
      await canvas.scrollIntoViewIfNeeded();
      await canvas.waitFor();
      // 64 × 64 checks by the shared engine, timed by the page itself (budget 100 ms).
      expect(Number(await page.getByTestId('mode-map-time').getAttribute('data-ms'))).toBeLessThan(100);
      const box = (await canvas.boundingBox())!;
      // The example is a cone: x is t/Dᵢ from 0.05 to 1.5, y the included angle from 30° to 180°.
      await canvas.click({ position: { x: box.width * 0.5, y: box.height * 0.25 } });
      const minor = Number(await page.getByLabel(/^Minor diameter/).inputValue());
      // Within a cell or two of where the click fell (the canvas border and pixel rounding).
      await expect.poll(async () => Math.abs(Number(await page.getByLabel(/^Thickness/).inputValue()) - (0.05 + 0.5 * 1.45) * minor)).toBeLessThan(0.02 * 1.45 * minor);
      expect(Math.abs(Number(await page.getByLabel(/^Included angle/).inputValue()) - (30 + 0.75 * 150))).toBeLessThan(0.02 * 150);
      await page.getByTestId('stale-results').waitFor();
      await page.getByRole('button', { name: 'Evaluate again' }).click();
      await expect.poll(async () => page.getByTestId('stale-results').count()).toBe(0);
    });

    it(`${width} px: the keyboard focus is visible on links and buttons`, async () => {
      const { page } = s;
      await openEvaluate(page, width);
      await page.locator('body').click({ position: { x: 1, y: 1 } });
      const seen: { tag: string; style: string; width: string }[] = [];
      for (let i = 0; i < 8; i++) {
        await page.keyboard.press('Tab');
        seen.push(
          await page.evaluate(() => {
            const el = document.activeElement as HTMLElement;
            const cs = getComputedStyle(el);
            return { tag: el.tagName, style: cs.outlineStyle, width: cs.outlineWidth };
          }),
        );
      }
      const controls = seen.filter((f) => f.tag === 'A' || f.tag === 'BUTTON');
      expect(controls.length).toBeGreaterThan(0);
      for (const f of controls) {
        expect(f.style).toBe('solid');
        expect(f.width).toBe('2px');
      }
    });

    it(`${width} px: the margins chart says how many of the ranked candidates it shows and pages through the rest`, async () => {
      const { page } = s;
      await openEvaluate(page, width);
      const total = Number(/(\d+) candidates? evaluated/.exec((await page.getByTestId('evaluation-summary').textContent()) ?? '')?.[1]);
      expect(total).toBeGreaterThan(12);
      const count = page.getByTestId('margin-chart-count');
      expect(await count.textContent()).toBe(`Showing 1–12 of ${total} candidates`);
      await page.getByRole('button', { name: /^Next/ }).click();
      expect(await count.textContent()).toBe(`Showing 13–${total} of ${total} candidates`);
      const label = (await page.getByRole('img', { name: /^Margins by failure mode per candidate/ }).getAttribute('aria-label')) ?? '';
      const names = label.replace(/^[^:]*: /, '').split('; ');
      expect(new Set(names).size).toBe(names.length);
    });
  }
});
