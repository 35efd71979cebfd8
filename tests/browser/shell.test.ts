import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { screenshotDir, seriousA11yViolations, signInOnPage, useBrowser } from '../support/browser.ts';

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

  it('loads the first page without router warnings (a fallback is shown while its code loads)', async () => {
    const { page, problems } = await b.newPage();
    const warnings: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'warning') warnings.push(message.text());
    });
    await page.goto(`${b.baseUrl}/sign-in`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).count()).toBe(1);
    expect(warnings.filter((w) => /HydrateFallback|hydrat/i.test(w))).toEqual([]);
    expect(problems).toEqual([]);
    await page.close();
  });

  it('shows a page that fails to load as an error inside its section, the workspace’s navigation still there', async () => {
    const { page } = await b.newPage();
    await signInOnPage(page, b.baseUrl, 'maren@harbour-light.test', 'etch-demo-2026', /\/studio\/harbour-light/);
    // The Team page's code cannot be fetched, as after a release replaced it.
    await page.route(/\/assets\/team-[^/]*\.js$/, (route) => route.abort());
    await page.getByRole('link', { name: 'Team', exact: true }).click();
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'This page could not be shown' }).count()).toBe(1);
    expect(await page.getByRole('navigation', { name: 'Workspace' }).count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Reload the page' }).count()).toBe(1);
    await page.screenshot({ path: join(screenshotDir, 'workspace-page-error.png'), fullPage: true });
    await page.close();
  });

  it('titles each page after itself and its place, so tabs and history can be told apart', async () => {
    const { page } = await b.newPage();
    const titled = async (path: string, title: string) => {
      await page.goto(`${b.baseUrl}${path}`);
      await expect.poll(() => page.title(), { message: path }).toBe(title);
    };
    await titled('/sign-in', 'Sign in · Etchwell');
    await titled('/s/harbour-light', 'Harbour Light Engraving');
    await titled('/s/harbour-light/cart', 'Cart · Harbour Light Engraving');
    await titled('/no-such-page', 'Not found · Etchwell');
    await signInOnPage(page, b.baseUrl, 'maren@harbour-light.test', 'etch-demo-2026', /\/studio\/harbour-light/);
    await titled('/studio/harbour-light/team', 'Team · Harbour Light Engraving workspace');
    await titled('/studio/harbour-light/catalog/recipes', 'Recipes · Harbour Light Engraving workspace');
    await page.close();
  });

  it('has no serious accessibility problems on the workspace pages (axe-core)', async () => {
    const { page } = await b.newPage({ bypassCSP: true });
    await signInOnPage(page, b.baseUrl, 'maren@harbour-light.test', 'etch-demo-2026', /\/studio\/harbour-light/);
    const paths = ['', '/orders', '/review', '/prep', '/production', '/catalog/blanks', '/catalog/materials', '/catalog/recipes'];
    for (const path of [...paths, '/team', '/settings', '/audit']) {
      await page.goto(`${b.baseUrl}/studio/harbour-light${path}`);
      await page.waitForLoadState('networkidle');
      expect(await seriousA11yViolations(page), path || 'overview').toEqual([]);
    }
    await page.close();
  });
});
