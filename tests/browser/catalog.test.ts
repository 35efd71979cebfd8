import { join } from 'node:path';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { screenshotDir, useBrowser } from '../support/browser.ts';

describe('an owner builds the catalog; staff can only look', () => {
  const b = useBrowser();
  const shot = (page: Page, name: string) => page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });

  beforeAll(async () => {
    await seedDemo(b.orm.em.fork());
  });

  async function signIn(email: string) {
    const session = await b.newPage();
    await session.page.goto(`${b.baseUrl}/sign-in`);
    await session.page.getByLabel('E-mail address').fill(email);
    await session.page.getByLabel('Password').fill(DEMO_PASSWORD);
    await session.page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await session.page.waitForURL(`${b.baseUrl}/studio/harbour-light`);
    return session;
  }

  it('owner creates a blank with two sizes, a photo and prices, puts it on sale, and buyers see it', async () => {
    const { page, problems } = await signIn('maren@harbour-light.test');
    await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Catalog' }).click();
    await page.waitForURL(`${b.baseUrl}/studio/harbour-light/catalog/blanks`);
    await page.getByRole('button', { name: 'New blank' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Walnut memory block');
    await dialog.getByLabel('Material').selectOption({ label: 'Walnut' });
    await dialog.getByLabel('Shape').selectOption({ label: 'Rounded rectangle' });
    await dialog.getByRole('button', { name: 'Create blank' }).click();
    await page.waitForURL(/\/catalog\/blanks\/[0-9a-f-]{36}$/);

    // The studio works in inches and dollars; a size that does not fit is caught in the form.
    await page.getByRole('button', { name: 'Add size' }).click();
    await dialog.getByLabel('Label').fill('5 × 7 in');
    await dialog.getByLabel('Blank width').fill('5');
    await dialog.getByLabel('Blank height').fill('7');
    await dialog.getByLabel('Engraving area width').fill('5.5');
    await dialog.getByLabel('Engraving area height').fill('6.5');
    await dialog.getByLabel('Price').fill('39');
    await dialog.getByRole('button', { name: 'Save size' }).click();
    await expect.poll(() => dialog.getByText('The engraving area must fit inside the blank.').count()).toBe(1);
    await shot(page, 'catalog-size-error');
    await dialog.getByLabel('Engraving area width').fill('4.5');
    await dialog.getByRole('button', { name: 'Save size' }).click();
    await expect.poll(() => page.getByRole('cell', { name: '5 × 7 in', exact: true }).count()).toBe(1);

    await page.getByRole('button', { name: 'Add size' }).click();
    await dialog.getByLabel('Label').fill('8 × 10 in');
    await dialog.getByLabel('Blank width').fill('8');
    await dialog.getByLabel('Blank height').fill('10');
    // 7.9 × 9.9 in is inside the 8 × 10 in rectangle but its corners reach past the rounded ones
    // (radius 0.64 in): the form says so and offers the largest area that fits.
    await dialog.getByLabel('Engraving area width').fill('7.9');
    await dialog.getByLabel('Engraving area height').fill('9.9');
    await expect.poll(() => dialog.getByText('The area reaches past the blank’s edge').count()).toBe(1);
    expect(await dialog.getByRole('button', { name: /^Use \d+(\.\d+)? × \d+(\.\d+)? in$/ }).count()).toBe(1);
    await shot(page, 'catalog-size-past-edge');
    await dialog.getByLabel('Engraving area width').fill('7.5');
    await dialog.getByLabel('Engraving area height').fill('9.5');
    await expect.poll(() => dialog.getByText('The area reaches past the blank’s edge').count()).toBe(0);
    await dialog.getByLabel('Price').fill('64.50');
    await dialog.getByLabel('Unlimited (made to order)').uncheck();
    await dialog.getByLabel('Blanks in stock').fill('2');
    await dialog.getByRole('button', { name: 'Save size' }).click();
    await expect.poll(() => page.getByRole('cell', { name: '$64.50' }).count()).toBe(1);
    // Shown in inches, stored in mm: 7.5 in is 190.5 mm exactly.
    expect(await page.getByText('7.5 × 9.5 in').count()).toBe(1);

    const photo = await sharp({ create: { width: 900, height: 700, channels: 3, background: '#c9a77c' } })
      .jpeg()
      .toBuffer();
    await page.getByLabel('Add product photos').setInputFiles({ name: 'plaque.jpg', mimeType: 'image/jpeg', buffer: photo });
    await expect
      .poll(
        () => page.getByRole('img', { name: 'Product photo 1' }).evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth),
        { timeout: 15_000 },
      )
      .toBe(900);

    // The studio has no recipe for walnut yet: it is said before the blank goes on sale.
    await page.getByRole('button', { name: 'Put on sale' }).click();
    const warning = page.getByRole('dialog', { name: /Put Walnut memory block on sale without/ });
    await expect.poll(() => warning.getByText(/a recipe for Walnut/).count()).toBe(1);
    expect(await warning.getByText(/product photo/).count()).toBe(0);
    await warning.getByRole('button', { name: 'Put on sale anyway' }).click();
    await expect.poll(() => page.getByText('Walnut memory block is on sale.').count()).toBe(1);
    // One place to set the status on a blank's page: its buttons, not a field in the form too.
    expect(await page.getByLabel('Status').count()).toBe(0);
    await shot(page, 'catalog-blank');

    await page.goto(`${b.baseUrl}/s/harbour-light`);
    await expect.poll(() => page.getByRole('heading', { name: 'Walnut memory block' }).count()).toBe(1);
    expect(await page.getByText('$39.00').count()).toBeGreaterThan(0);
    await shot(page, 'catalog-on-storefront');

    // Both new prices are in the audit log, under the owner's name.
    await page.goto(`${b.baseUrl}/studio/harbour-light`);
    await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Audit log' }).click();
    await page.getByLabel('Show').selectOption({ label: 'Prices' });
    await expect
      .poll(() =>
        page
          .getByRole('row')
          .filter({ hasText: 'Walnut memory block, 8 × 10 in' })
          .filter({ hasText: 'New size offered at $64.50.' })
          .filter({ hasText: 'Maren Quist' })
          .count(),
      )
      .toBe(1);
    expect(
      await page
        .getByRole('row')
        .filter({ hasText: 'Walnut memory block, 5 × 7 in' })
        .filter({ hasText: 'New size offered at $39.00.' })
        .count(),
    ).toBe(1);
    await shot(page, 'audit-log-prices');
    expect(problems).toEqual([]);
  });

  it('owner sees materials and recipes with their cautions; a forbidden material is flagged', async () => {
    const { page, problems } = await signIn('maren@harbour-light.test');
    await page.goto(`${b.baseUrl}/studio/harbour-light/catalog/materials`);
    await page.getByLabel('Search materials').fill('walnut');
    await expect.poll(() => page.getByText(/of \d+ shown/).textContent()).toMatch(/^1 of/);
    await page.getByLabel('Search materials').fill('');
    await page.getByLabel('Family', { exact: true }).selectOption({ label: 'Plastic' });
    await expect.poll(() => page.getByText('Never on CO2').count()).toBeGreaterThan(0);
    await shot(page, 'catalog-materials');

    await page.goto(`${b.baseUrl}/studio/harbour-light/catalog/recipes`);
    await expect.poll(() => page.getByText('Class 4 laser product').count()).toBe(1);
    await page.getByRole('button', { name: 'New recipe' }).click();
    const dialog = page.getByRole('dialog');
    const optionText = async (field: string, text: string) =>
      (await dialog.getByLabel(field).locator('option', { hasText: text }).first().textContent())!;
    await dialog.getByLabel('Material').selectOption({ label: await optionText('Material', 'PVC and vinyl') });
    await dialog.getByLabel('Machine').selectOption({ label: await optionText('Machine', 'CO2') });
    await expect.poll(() => dialog.getByText(/must never go on a CO2 laser/).count()).toBe(1);
    await dialog.getByLabel('Speed').fill('300');
    await dialog.getByLabel('Lowest power').fill('10');
    await dialog.getByLabel('Highest power').fill('20');
    await dialog.getByRole('button', { name: 'Save recipe' }).click();
    await expect.poll(() => dialog.getByText(/PVC and vinyl must never be engraved on a CO2 laser/).count()).toBeGreaterThan(0);
    await shot(page, 'catalog-recipe-refused');
    // The refusal itself is the one failed request the browser reports.
    expect(problems).toEqual(['console: Failed to load resource: the server responded with a status of 400 (Bad Request)']);
  });

  it('staff sees the catalog but no controls to change it', async () => {
    const { page, problems } = await signIn('tobias@harbour-light.test');
    await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Catalog' }).click();
    await expect
      .poll(() => page.getByRole('link', { name: 'Walnut memory block' }).count())
      .toBe(1)
      .catch(async (error) => {
        await shot(page, 'catalog-staff-failed');
        throw error;
      });
    expect(await page.getByText('Only the studio’s owners can change it.').count()).toBe(1);
    expect(await page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Audit log' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'New blank' }).count()).toBe(0);
    await page.getByRole('link', { name: 'Walnut memory block' }).click();
    await expect.poll(() => page.getByRole('cell', { name: '8 × 10 in', exact: true }).count()).toBe(1);
    expect(await page.getByRole('button', { name: /Add size|Edit|Remove|Put on sale|Archive|Save details/ }).count()).toBe(0);
    expect(await page.getByLabel('Name').isDisabled()).toBe(true);
    await shot(page, 'catalog-staff');
    for (const tab of ['Materials', 'Machines', 'Recipes']) {
      await page.getByRole('navigation', { name: 'Catalog' }).getByRole('link', { name: tab }).click();
      await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(tab);
      expect(await page.getByRole('button', { name: /^(New|Edit|Delete)/ }).count()).toBe(0);
    }
    expect(problems).toEqual([]);
  });

  it('asks a round blank for its diameter, once, and an oval for its two axes', async () => {
    const { page, problems } = await signIn('maren@harbour-light.test');
    await page.goto(`${b.baseUrl}/studio/harbour-light/catalog/blanks`);
    await page.getByRole('button', { name: 'New blank' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill('Round walnut coaster');
    await dialog.getByLabel('Material').selectOption({ label: 'Walnut' });
    await dialog.getByLabel('Shape').selectOption({ label: 'Circle' });
    await dialog.getByRole('button', { name: 'Create blank' }).click();
    await page.waitForURL(/\/catalog\/blanks\/[0-9a-f-]{36}$/);
    await page.getByRole('button', { name: 'Add size' }).click();
    expect(await dialog.getByLabel('Blank diameter').count()).toBe(1);
    expect(await dialog.getByLabel('Blank height').count()).toBe(0);
    await dialog.getByLabel('Label').fill('4 in round');
    await dialog.getByLabel('Blank diameter').fill('4');
    // A 2.8 in square inside a 4 in circle: its diagonal is 3.96 in, just inside (by hand).
    await dialog.getByLabel('Engraving area width').fill('2.8');
    await dialog.getByLabel('Engraving area height').fill('2.8');
    await dialog.getByLabel('Price').fill('24');
    await dialog.getByRole('button', { name: 'Save size' }).click();
    await expect.poll(() => page.getByRole('cell', { name: '4 in round', exact: true }).count()).toBe(1);
    expect(problems).toEqual([]);
  });
});
