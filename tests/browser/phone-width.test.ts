import { join } from 'node:path';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { referencePhotoDir } from '../support/pillow.ts';
import { freePort, screenshotDir, sidewaysOverflow, signInOnPage, useBrowser } from '../support/browser.ts';
import { useMailFake } from '../support/mail.ts';
import { usePaymentsFake } from '../support/payments.ts';

const PHONE = { width: 390, height: 844 };

/**
 * Controls under 24 × 24 CSS pixels that a finger must hit: WCAG 2.2, success criterion 2.5.8
 * "Target Size (Minimum)". Links inside running text are exempt there, and so are they here.
 */
async function smallTargets(page: Page, within: string): Promise<string[]> {
  return page.evaluate(`(() => {
    const root = document.querySelector(${JSON.stringify(within)});
    if (!root) return ['no ' + ${JSON.stringify(within)} + ' on the page'];
    return [...root.querySelectorAll('a, button, input, select, textarea')]
      .filter((e) => e.type !== 'hidden' && e.type !== 'file' && !(e.tagName === 'A' && e.closest('p')))
      .map((e) => ({ e, box: e.getBoundingClientRect() }))
      .filter(({ box }) => box.width > 0 && (box.width < 24 || box.height < 24))
      .map(({ e, box }) => (e.getAttribute('aria-label') || e.textContent || e.name || e.type).trim() + ' ' + Math.round(box.width) + '×' + Math.round(box.height));
  })()`);
}

/**
 * The storefront and the workspace on a 390-pixel phone: no page scrolls sideways, the checkout
 * form's controls are big enough to tap, and coming back from the pay page keeps what was typed.
 */
describe('on a 390-pixel phone', () => {
  const mail = useMailFake();
  const payments = usePaymentsFake();
  const b = useBrowser(async () => {
    await mail.start();
    const port = await freePort();
    return { ...(await payments.start()), SMTP_URL: mail.smtpUrl, APP_URL: `http://127.0.0.1:${port}` };
  });
  const shot = (page: Page, name: string) => page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });
  let photo: Buffer;

  beforeAll(async () => {
    await seedDemo(b.orm.em.fork());
    payments.connect(b.baseUrl);
    photo = await sharp(join(referencePhotoDir, 'astronaut.png'))
      .resize(2048, 2048, { kernel: 'lanczos3' })
      .jpeg({ quality: 90 })
      .toBuffer();
  });

  async function phonePage() {
    const opened = await b.newPage();
    await opened.page.setViewportSize(PHONE);
    return opened;
  }

  it('a buyer designs, checks out, goes to the pay page and back: nothing scrolls sideways and the form is kept', async () => {
    const { page, problems } = await phonePage();
    await page.goto(`${b.baseUrl}/s/harbour-light`);
    await page.waitForLoadState('networkidle');
    expect(await sidewaysOverflow(page), 'storefront home').toBe(0);

    await page.getByRole('link', { name: 'Black-backed glass portrait' }).click();
    await page.waitForURL(/\/s\/harbour-light\/blanks\//);
    await page.getByRole('radio', { name: /8 × 10 in/ }).check();
    await page.getByLabel('Choose your photo').setInputFiles({ name: 'astronaut.jpg', mimeType: 'image/jpeg', buffer: photo });
    await expect.poll(() => page.locator('canvas[data-drawn="true"]').count(), { timeout: 20_000 }).toBe(1);
    expect(await sidewaysOverflow(page), 'designer with a photo').toBe(0);
    expect(await smallTargets(page, 'section[aria-labelledby="designer-title"]'), 'designer').toEqual([]);
    await shot(page, 'phone-designer');
    await page.getByLabel('I took this photo or have permission to use it.').check();
    await page.getByRole('button', { name: /^Add to cart/ }).click();

    await page.waitForURL(`${b.baseUrl}/s/harbour-light/cart`);
    await page.waitForLoadState('networkidle');
    expect(await sidewaysOverflow(page), 'cart').toBe(0);
    expect(await smallTargets(page, 'main'), 'cart and checkout form').toEqual([]);
    await page.getByLabel('E-mail address').fill('june@buyers.test');
    await page.getByLabel('Your name').fill('June Aldous');
    await page.getByRole('radio', { name: /Tracked post/ }).check();
    await page.getByLabel('Street and number').fill('3 Orchard Row');
    await page.getByLabel('Town or city').fill('Kettleby');
    await page.getByLabel('Postcode').fill('KB1 2CD');
    await page.getByLabel('Country code').fill('GB');
    await shot(page, 'phone-cart');
    await page.getByRole('button', { name: 'Go to payment' }).click();

    await page.waitForURL(new RegExp(`^${payments.url}/pay/`));
    expect(await sidewaysOverflow(page), 'pay page').toBe(0);
    expect(await page.getByText('Practice payment — no money moves').count()).toBe(1);
    expect(await smallTargets(page, 'main'), 'pay page').toEqual([]);
    await shot(page, 'phone-pay-page');
    // An outcome button fills in the card number it stands for.
    await page.getByRole('button', { name: /^Not enough funds/ }).click();
    expect(await page.getByLabel('Card number').inputValue()).toBe('4000 0000 0000 9995');

    await page.getByRole('link', { name: /Back to the shop without paying/ }).click();
    await page.waitForURL(`${b.baseUrl}/s/harbour-light/cart`);
    await expect.poll(() => page.getByLabel('E-mail address').inputValue()).toBe('june@buyers.test');
    expect(await page.getByLabel('Your name').inputValue()).toBe('June Aldous');
    expect(await page.getByLabel('Street and number').inputValue()).toBe('3 Orchard Row');
    expect(await page.getByRole('radio', { name: /Tracked post/ }).isChecked()).toBe(true);
    expect(problems).toEqual([]);
  });

  it('an empty file gets its own message, not the form’s', async () => {
    const { page } = await phonePage();
    await page.goto(`${b.baseUrl}/s/harbour-light`);
    await page.getByRole('link', { name: 'Black-backed glass portrait' }).click();
    await page.waitForURL(/\/s\/harbour-light\/blanks\//);
    await page.getByLabel('Choose your photo').setInputFiles({ name: 'empty.jpg', mimeType: 'image/jpeg', buffer: Buffer.alloc(0) });
    await expect.poll(() => page.getByText(/This file is empty \(0 bytes\)/).count()).toBe(1);
    expect(await page.getByText('Some fields are not valid.').count()).toBe(0);
  });

  it('staff can use every section of the workspace without sideways scrolling', async () => {
    const { page, problems } = await phonePage();
    await signInOnPage(page, b.baseUrl, 'maren@harbour-light.test', 'etch-demo-2026', /\/studio\/harbour-light/);
    const sections = ['', '/orders', '/review', '/production', '/catalog/blanks', '/catalog/materials', '/catalog/machines'];
    for (const path of [...sections, '/catalog/recipes', '/team', '/settings', '/audit']) {
      await page.goto(`${b.baseUrl}/studio/harbour-light${path}`);
      await page.waitForLoadState('networkidle');
      expect(await sidewaysOverflow(page), path || 'overview').toBe(0);
    }
    await page.goto(`${b.baseUrl}/studio/harbour-light/catalog/blanks`);
    await page.getByRole('link', { name: 'Black-backed glass portrait' }).first().click();
    await page.waitForURL(/\/catalog\/blanks\/.+/);
    await page.waitForLoadState('networkidle');
    expect(await sidewaysOverflow(page), 'a blank with its sizes').toBe(0);
    await shot(page, 'phone-workspace-blank');
    expect(problems).toEqual([]);
  });
});
