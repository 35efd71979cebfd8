import { join } from 'node:path';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { referencePhotoDir as referencePhotosDir } from '../support/pillow.ts';
import { freePort, screenshotDir, seriousA11yViolations, sidewaysOverflow, useBrowser } from '../support/browser.ts';
import { useMailFake } from '../support/mail.ts';
import { usePaymentsFake } from '../support/payments.ts';

/**
 * The buyer's whole story on the demo studio: a photo to a paid order, in Chromium, with the
 * payments and mail stand-ins. The photo is scikit-image's "astronaut" (NASA, public domain),
 * enlarged 4× with Lanczos so an 8 × 10 in print is within reach.
 */
describe('a buyer orders a glass portrait and pays', () => {
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
    photo = await sharp(join(referencePhotosDir, 'astronaut.png'))
      .resize(2048, 2048, { kernel: 'lanczos3' })
      .jpeg({ quality: 90 })
      .toBuffer();
  });

  async function openDesigner(page: Page) {
    await page.goto(`${b.baseUrl}/s/harbour-light`);
    await page.getByRole('link', { name: 'Black-backed glass portrait' }).click();
    await page.waitForURL(/\/s\/harbour-light\/blanks\//);
    await page.getByRole('radio', { name: /8 × 10 in/ }).check();
  }

  it('from the storefront to the order page, paid, with the confirmation e-mail', async () => {
    const { page, problems } = await b.newPage();
    // Slow the upload to storage down a little, so the progress bar can be seen working.
    let progressSeen = false;
    await page.route('**/uploads/**', async (route) => {
      await new Promise((resolve) => setTimeout(resolve, 600));
      await route.continue();
    });
    await openDesigner(page);
    // Every step is there from the start; placement waits for a photo.
    expect(await page.locator('legend').allTextContents()).toEqual(['1. Size', '2. Photo', '3. Placement', '4. Words (optional)']);
    expect(await page.getByText('Choose a photo first; then move, zoom, turn and straighten it here.').count()).toBe(1);
    await page.getByLabel('Choose your photo').setInputFiles({ name: 'astronaut.jpg', mimeType: 'image/jpeg', buffer: photo });
    await expect
      .poll(async () => (progressSeen ||= (await page.getByRole('progressbar', { name: 'Upload progress' }).count()) > 0))
      .toBe(true);
    // Worked by hand: the square photo fills the 7.5 × 9.5 in area by its height, 2048 px over
    // 9.5 in = 215.6 pixels per inch: "fair" by print practice (150–300).
    await expect
      .poll(() => page.getByRole('status').filter({ hasText: 'resolution' }).textContent(), { timeout: 15_000 })
      .toMatch(/Fair resolution: 215 pixels per inch at 7.5 × 9.5 in/);
    expect(await page.getByRole('progressbar').count()).toBe(0);
    await expect.poll(() => page.locator('canvas[data-drawn="true"]').count(), { timeout: 15_000 }).toBe(1);
    // The buyer sees the picture, not how long it took to draw.
    expect(await page.getByText(/drawn in \d+ ms/).count()).toBe(0);
    await page.getByRole('button', { name: 'Your photo' }).click();
    await page.getByRole('button', { name: 'As it will burn' }).click();
    await page.getByLabel('Zoom', { exact: true }).fill('1.2');
    expect(await page.getByText('1.20×').count()).toBe(1);
    // A quarter turn leaves the fine straightening alone; straightening stays within ±15°.
    await page.getByLabel('Straighten', { exact: true }).fill('2.5');
    await page.getByRole('button', { name: 'Turn right' }).click();
    expect(await page.getByLabel('Straighten', { exact: true }).inputValue()).toBe('2.5');
    expect(await page.getByText('+2.5°').count()).toBe(1);
    expect(await page.getByLabel('Straighten', { exact: true }).getAttribute('max')).toBe('15');
    await page.getByRole('button', { name: 'Turn left' }).click();
    await page.getByLabel('Straighten', { exact: true }).fill('0');
    await page.getByLabel('I took this photo or have permission to use it.').check();
    await shot(page, 'storefront-designer');
    await page.getByRole('button', { name: /^Add to cart/ }).click();

    await page.waitForURL(`${b.baseUrl}/s/harbour-light/cart`);
    await page.getByLabel('E-mail address').fill('june@buyers.test');
    await page.getByLabel('Your name').fill('June Aldous');
    await page.getByRole('radio', { name: /Tracked post/ }).check();
    await page.getByLabel('Street and number').fill('3 Orchard Row');
    await page.getByLabel('Town or city').fill('Kettleby');
    await page.getByLabel('Postcode').fill('KB1 2CD');
    await page.getByLabel('Country code').fill('US');
    await shot(page, 'storefront-cart');
    await page.getByRole('button', { name: 'Go to payment' }).click();

    await page.waitForURL(new RegExp(`^${payments.url}/pay/`));
    // $69.00 for the portrait and $8.95 for tracked post, from the demo catalog.
    expect(await page.locator('.total').textContent()).toBe('$77.95');
    await page.getByLabel('Card number').fill('4242 4242 4242 4242');
    await page.getByLabel('Expiry (MM / YY)').fill('12 / 34');
    await page.getByLabel('Security code').fill('123');
    await page.getByLabel('Name on card').fill('June Aldous');
    await page.getByRole('button', { name: /^Pay/ }).click();

    await page.waitForURL(/\/s\/harbour-light\/orders\/.+paid=1/);
    await expect.poll(() => page.getByText('Paid', { exact: true }).count(), { timeout: 15_000 }).toBe(1);
    await expect.poll(() => page.getByRole('img', { name: /as it will burn/ }).count()).toBe(1);
    expect(await page.getByText('Photo being checked').count()).toBe(1);
    await page.waitForTimeout(500); // the item's mock-up draws itself
    await shot(page, 'storefront-order-paid');
    // The cart became the order.
    expect(await page.getByRole('link', { name: /^Cart$/ }).count()).toBe(1);

    const receipt = await mail.latestTo('june@buyers.test');
    expect(receipt.subject).toMatch(/^Your order \d+ at Harbour Light Engraving$/);
    // From the studio by name, at Etchwell's own sending address.
    expect(receipt.from).toMatch(/^"?Harbour Light Engraving"? <no-reply@etchwell\.localhost>$/);
    const link = receipt.links.find((l) => l.includes('/orders/'))!;
    const again = await b.newPage();
    await again.page.goto(link);
    await expect.poll(() => again.page.getByText('Paid', { exact: true }).count()).toBe(1);
    expect([...problems, ...again.problems]).toEqual([]);
  });

  it('offers portrait or landscape only where the engraving area is not square', async () => {
    const { page, problems } = await b.newPage();
    await openDesigner(page);
    expect(await page.getByRole('group', { name: 'Orientation' }).count()).toBe(1);
    // The round slate coaster's area is 70 × 70 mm: either way round is the same.
    await page.goto(`${b.baseUrl}/s/fernhill-stone`);
    await page.getByRole('link', { name: 'Slate coaster' }).first().click();
    await page.waitForURL(/\/s\/fernhill-stone\/blanks\//);
    await expect.poll(() => page.getByText('2. Photo').count()).toBe(1);
    expect(await page.getByRole('group', { name: 'Orientation' }).count()).toBe(0);
    // On a 390-pixel phone the stage shrinks to fit: nothing scrolls sideways.
    await page.setViewportSize({ width: 390, height: 844 });
    await expect.poll(() => sidewaysOverflow(page)).toBe(0);
    await page.screenshot({ path: join(screenshotDir, 'storefront-designer-phone.png'), fullPage: true });
    expect(problems).toEqual([]);
  });

  it('warns when the photo leaves part of the area empty, and keeps the design across a reload', async () => {
    const { page, problems } = await b.newPage();
    await openDesigner(page);
    await page.getByLabel('Choose your photo').setInputFiles({ name: 'astronaut.jpg', mimeType: 'image/jpeg', buffer: photo });
    await expect.poll(() => page.locator('canvas[data-drawn="true"]').count(), { timeout: 15_000 }).toBe(1);
    const empty = page.getByText(/Part of the engraving area is left empty/);
    expect(await empty.count()).toBe(0);
    // The square photo shown whole in the 7.5 × 9.5 in portrait area leaves bands above and below.
    await page.getByRole('button', { name: 'Show it all' }).click();
    await expect.poll(() => empty.count()).toBe(1);
    await page.reload();
    await expect.poll(() => page.locator('canvas[data-drawn="true"]').count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByRole('button', { name: 'Show it all' }).getAttribute('aria-pressed')).toBe('true');
    expect(await page.getByRole('radio', { name: /8 × 10 in/ }).isChecked()).toBe(true);
    await expect.poll(() => empty.count()).toBe(1);
    await page.getByRole('button', { name: 'Fill the area' }).click();
    await expect.poll(() => empty.count()).toBe(0);
    expect(problems).toEqual([]);
  });

  it('says a 320 × 240 photo is too low and suggests what to do', async () => {
    const { page, problems } = await b.newPage();
    await openDesigner(page);
    const small = await sharp(join(referencePhotosDir, 'chelsea.png')).resize(320, 240, { fit: 'cover' }).jpeg().toBuffer();
    await page.getByLabel('Choose your photo').setInputFiles({ name: 'cat.jpg', mimeType: 'image/jpeg', buffer: small });
    // By hand: the landscape photo fills the portrait area by its height, 240 px over 9.5 in =
    // 25 pixels per inch; at 5 × 7 in (6.5 in high) still 36, so no size offered reaches 150.
    await expect
      .poll(() => page.getByRole('status').filter({ hasText: 'resolution' }).textContent(), { timeout: 15_000 })
      .toMatch(/Resolution too low: 25 pixels per inch.*upload a larger photo/);
    await page.getByRole('button', { name: /^Add to cart/ }).click();
    await expect.poll(() => page.getByText('Confirm the low resolution, or choose a smaller size.').count()).toBe(1);
    await shot(page, 'storefront-designer-too-low');
    expect(problems).toEqual([]);
  });

  it('has no serious accessibility problems on the storefront pages (axe-core)', async () => {
    const { page } = await b.newPage({ bypassCSP: true });
    for (const path of ['/s/harbour-light', '/s/harbour-light/cart']) {
      await page.goto(`${b.baseUrl}${path}`);
      await page.waitForLoadState('networkidle');
      expect(await seriousA11yViolations(page), path).toEqual([]);
    }
    await openDesigner(page);
    expect(await seriousA11yViolations(page), 'designer').toEqual([]);
  });
});
