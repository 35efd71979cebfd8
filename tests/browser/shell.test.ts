import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { screenshotDir, useBrowser } from '../support/browser.ts';

describe('client shell in Chromium', () => {
  const b = useBrowser();

  beforeAll(async () => {
    await seedDemo(b.orm.em.fork());
  });

  it('opens the home page with its own heading and no console errors', async () => {
    const { page, problems } = await b.newPage();
    await page.goto(`${b.baseUrl}/`);
    const heading = page.getByRole('heading', { level: 1 });
    await expect.poll(() => heading.textContent()).toContain('Etchwell turns your buyers’ photos into files your laser can burn.');
    // The bundled font is the one in use, not a fallback from the system.
    await expect.poll(() => page.evaluate(() => document.fonts.check('16px Nunito'))).toBe(true);
    await page.screenshot({ path: join(screenshotDir, 'home.png'), fullPage: true });
    expect(problems).toEqual([]);
    await page.close();
  });

  it('opens a demo storefront in the studio’s own colour', async () => {
    const { page, problems } = await b.newPage();
    await page.goto(`${b.baseUrl}/s/harbour-light`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Your photo, engraved by Harbour Light Engraving');
    const accent = await page.evaluate(() => getComputedStyle(document.querySelector('header')!).borderBottomColor);
    expect(accent).toBe('rgb(31, 111, 139)'); // #1f6f8b, the demo studio's accent
    // The demo catalog: active blanks with sizes and prices in the studio's currency.
    await expect.poll(() => page.getByRole('heading', { name: 'Black-backed glass portrait' }).count()).toBe(1);
    expect(await page.getByText('$69.00').count()).toBe(1);
    await page.screenshot({ path: join(screenshotDir, 'storefront.png'), fullPage: true });
    expect(problems).toEqual([]);
    await page.close();
  });

  it('shows its own not-found page for an unknown address', async () => {
    const { page, problems } = await b.newPage();
    const response = await page.goto(`${b.baseUrl}/no/such/page`);
    expect(response?.status()).toBe(200); // the shell answers; the client shows not-found
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('There is nothing at this address');
    expect(problems).toEqual([]);
    await page.close();
  });
});
