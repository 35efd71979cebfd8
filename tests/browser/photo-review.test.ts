import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import request from 'supertest';
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { Blank } from '#server/features/catalog/catalog.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { ShippingRate } from '#server/features/shipping/shipping-rate.entity.ts';
import { freePort, screenshotDir, signInOnPage, useBrowser } from '../support/browser.ts';
import { useMailFake } from '../support/mail.ts';
import { payWithTestCard, postSignedEvent } from '../support/payments.ts';
import { pillowImageInfo, referencePhotoDir } from '../support/pillow.ts';
import { pdfText } from '../support/pdf.ts';
import { eventually } from '../support/fakes.ts';

/**
 * Staff flag a photo too low in resolution; the buyer gets the e-mail, sends a larger photo by
 * its link, and the item is back in review. Photos: scikit-image's "chelsea" (CC0) as sent, and
 * "astronaut" (NASA, public domain) enlarged 4× as the better one.
 */
describe('photo review: asking the buyer for a better photo', () => {
  const mail = useMailFake();
  const b = useBrowser(
    async () => {
      await mail.start();
      return { SMTP_URL: mail.smtpUrl, APP_URL: `http://127.0.0.1:${await freePort()}` };
    },
    { worker: true },
  );
  const shot = (page: Page, name: string) => page.screenshot({ path: join(screenshotDir, `${name}.png`), fullPage: true });
  let orderNumber: number;

  beforeAll(async () => {
    await seedDemo(b.orm.em.fork());
    const em = b.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    const glass = await em.findOneOrFail(
      Blank,
      { name: 'Black-backed glass portrait' },
      { populate: ['sizes'], filters: { [TENANT_FILTER]: { studioId: studio.id } } },
    );
    const size = glass.sizes.getItems().find((s) => s.label === '5 × 7 in')!;
    const rate = await em.findOneOrFail(
      ShippingRate,
      { studio, priceMinor: 895 },
      { filters: { [TENANT_FILTER]: { studioId: studio.id } } },
    );
    // The buyer's order, placed and paid as the storefront and the payment webhook do it.
    const bytes = await sharp(join(referencePhotoDir, 'chelsea.png')).jpeg().toBuffer();
    const store = '/api/storefront/harbour-light';
    const ticket = (
      await request(b.app).post(`${store}/photo-uploads`).send({ contentType: 'image/jpeg', contentLength: bytes.length }).expect(201)
    ).body;
    await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(bytes) });
    const photo = (await request(b.app).post(`${store}/buyer-photos`).send({ key: ticket.key }).expect(201)).body;
    const placed = await request(b.app)
      .post(`${store}/orders`)
      .send({
        items: [
          {
            blankId: glass.id,
            sizeId: size.id,
            orientation: 'landscape',
            quantity: 1,
            photoId: photo.id,
            placement: { crop: { left: 0, top: 12, width: (276 * 6.5) / 4.5, height: 276 } },
            rightsConfirmed: true,
            lowResolutionConfirmed: true,
          },
        ],
        buyer: { email: 'june@buyers.test', name: 'June Aldous' },
        delivery: {
          method: 'ship',
          rateId: rate.id,
          address: { line1: '7 Gull Row', city: 'Port Alder', postalCode: '04412', country: 'US' },
        },
      })
      .expect(201);
    await payWithTestCard(placed.body.paymentUrl);
    const session = await b.payments.stripe.checkout.sessions.retrieve(new URL(placed.body.paymentUrl).pathname.split('/').pop()!);
    const paid = await postSignedEvent(b, {
      id: `evt_review_${session.id}`,
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: session },
    }).expect(200);
    expect(paid.body.outcome).toBe('handled');
    orderNumber = (
      await request(b.app)
        .get(new URL(session.success_url!).pathname.replace('/s/', '/api/storefront/') + new URL(session.success_url!).search)
        .expect(200)
    ).body.number;
  });

  it('staff flag the photo, the buyer sends a larger one by the e-mailed link, and it is back in review', async () => {
    const staff = await b.newPage();
    await signInOnPage(staff.page, b.baseUrl, 'tobias@harbour-light.test', DEMO_PASSWORD, `${b.baseUrl}/studio/harbour-light`);
    // Today: one photo waits for review, and this week has the order.
    await expect.poll(() => staff.page.getByRole('img', { name: /Orders per week, last 12 weeks: (0, ){11}1$/ }).count()).toBe(1);
    await staff.page.mouse.move(0, 0);
    await shot(staff.page, 'workspace-today');
    await staff.page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Photo review' }).click();
    // A 398.7 × 276 px window on the 6.5 × 4.5 in area: 61 pixels per inch, too low.
    await expect.poll(() => staff.page.getByText('61 pixels per inch (too low)').count()).toBe(1);
    await staff.page.waitForTimeout(500);
    await shot(staff.page, 'review-queue');
    await staff.page.getByRole('button', { name: 'Ask for a new photo' }).click();
    await staff.page.getByLabel('Note to the buyer (optional)').fill('The original from your phone would be sharper.');
    await staff.page.getByRole('button', { name: 'Send the request' }).click();
    await expect.poll(() => staff.page.getByText(`Asked for a new photo for order ${orderNumber}`).count()).toBe(1);
    await expect.poll(() => staff.page.getByText('No photos are waiting.', { exact: false }).count()).toBe(1);

    const request_ = await eventually(async () => {
      const newest = await mail.latestTo('june@buyers.test');
      return newest.subject.includes('needs a new photo') ? newest : undefined;
    });
    expect(request_.subject).toBe(`Order ${orderNumber}: Harbour Light Engraving needs a new photo`);
    expect(request_.text).toMatch(
      /Why: Resolution too low for the size\.\nFrom the studio: The original from your phone would be sharper\./,
    );
    const link = request_.links.find((l) => l.includes('/replace/'))!;

    const buyer = await b.newPage();
    await buyer.page.goto(link);
    await expect.poll(() => buyer.page.getByText('Why: Resolution too low for the size').count()).toBe(1);
    const better = await sharp(join(referencePhotoDir, 'astronaut.png'))
      .resize(2048, 2048, { kernel: 'lanczos3' })
      .jpeg({ quality: 90 })
      .toBuffer();
    await buyer.page.getByLabel('Choose your photo').setInputFiles({ name: 'astronaut.jpg', mimeType: 'image/jpeg', buffer: better });
    // The square photo fills the 6.5 × 4.5 in area by its width: 2048 / 6.5 = 315 pixels per inch.
    await expect.poll(() => buyer.page.getByRole('status').textContent(), { timeout: 15_000 }).toMatch(/Good: 315 pixels per inch/);
    await buyer.page.getByLabel('I took this photo or have permission to use it.').check();
    await buyer.page.waitForTimeout(500);
    await shot(buyer.page, 'replace-photo');
    await buyer.page.getByRole('button', { name: 'Send this photo' }).click();
    await expect.poll(() => buyer.page.getByText('Thank you!').count()).toBe(1);

    await staff.page.reload();
    await expect.poll(() => staff.page.getByText('This is the buyer’s replacement photo number 1.').count()).toBe(1);
    expect(await staff.page.getByText('315 pixels per inch (good)').count()).toBe(1);
    await staff.page.waitForTimeout(500);
    await shot(staff.page, 'review-replacement');
    expect([...staff.problems, ...buyer.problems]).toEqual([]);
  });

  it('the owner refunds part of the order from its page; the buyer is told', async () => {
    const owner = await b.newPage();
    await signInOnPage(owner.page, b.baseUrl, 'maren@harbour-light.test', DEMO_PASSWORD, `${b.baseUrl}/studio/harbour-light`);
    await owner.page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Orders' }).click();
    await owner.page.getByLabel('Search').fill('june@');
    await owner.page.getByRole('link', { name: String(orderNumber) }).click();
    await owner.page.getByRole('button', { name: 'Refund' }).click();
    await owner.page.getByLabel('Amount').fill('10');
    await owner.page.getByLabel('Reason (the buyer sees it)').fill('A goodwill refund for the wait.');
    await owner.page.getByRole('button', { name: 'Send the refund' }).click();
    await expect.poll(() => owner.page.getByText('−$10.00').count()).toBe(1);
    await expect.poll(() => owner.page.getByText(/Refunded in part: \$10\.00, by Maren Quist/).count()).toBe(1);
    await shot(owner.page, 'order-refunded');
    const told = await eventually(async () => {
      const newest = await mail.latestTo('june@buyers.test');
      return newest.subject.includes('refunded') ? newest : undefined;
    });
    expect(told.subject).toBe(`Order ${orderNumber}: $10.00 refunded`);
    expect(owner.problems).toEqual([]);
  });

  it('staff approve the new photo, prep it and send a proof; the buyer approves it by the e-mailed link', async () => {
    const staff = await b.newPage();
    await signInOnPage(staff.page, b.baseUrl, 'tobias@harbour-light.test', DEMO_PASSWORD, `${b.baseUrl}/studio/harbour-light`);
    await staff.page.goto(`${b.baseUrl}/studio/harbour-light/review`);
    await staff.page.getByRole('button', { name: 'Approve photo' }).click();
    await expect.poll(() => staff.page.getByText(`Photo approved: order ${orderNumber} waits in Prep.`).count()).toBe(1);
    // The last photo in review approved, staff land in the prep queue, where it waits.
    await staff.page.waitForURL(`${b.baseUrl}/studio/harbour-light/prep`);
    const queue = staff.page.getByRole('list', { name: 'Waiting for prep' });
    await expect.poll(() => queue.getByRole('link', { name: new RegExp(`Order ${orderNumber}`) }).count()).toBe(1);
    expect(
      await staff.page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Prep' }).getAttribute('aria-current'),
    ).toBe('page');
    await queue.getByRole('link', { name: new RegExp(`Order ${orderNumber}`) }).click();
    await staff.page.waitForURL(/\/studio\/harbour-light\/items\//);
    // The recipe's settings to start from: 360 lines per inch, as a negative on painted glass.
    await expect.poll(() => staff.page.getByLabel('Line density').inputValue()).toBe('360');
    expect(await staff.page.getByLabel('Negative (the burn is lighter)').isChecked()).toBe(true);
    await staff.page.getByLabel('Sharpen amount').fill('240');
    // The cut-out: start without the plain background, paint one stroke away, undo and redo it.
    await staff.page.getByRole('radio', { name: 'Cut-out' }).click();
    await staff.page.getByLabel('Without a plain background').check();
    await staff.page.getByRole('radio', { name: 'Remove' }).click();
    const canvas = (await staff.page.getByLabel('Paint to keep or remove parts of the photo').boundingBox())!;
    await staff.page.mouse.move(canvas.x + canvas.width * 0.1, canvas.y + canvas.height * 0.15);
    await staff.page.mouse.down();
    for (let i = 1; i <= 10; i++) await staff.page.mouse.move(canvas.x + canvas.width * (0.1 + i * 0.03), canvas.y + canvas.height * 0.15);
    await staff.page.mouse.up();
    await expect.poll(() => staff.page.getByText('1 stroke', { exact: true }).count()).toBe(1);
    await staff.page.getByRole('button', { name: 'Undo' }).click();
    await expect.poll(() => staff.page.getByText('0 strokes', { exact: true }).count()).toBe(1);
    await staff.page.getByRole('button', { name: 'Redo' }).click();
    await expect.poll(() => staff.page.getByText('1 stroke', { exact: true }).count()).toBe(1);
    await staff.page.waitForTimeout(500);
    await shot(staff.page, 'item-cutout');
    // One region at the machine's resolution, one dot per screen pixel.
    await staff.page.getByRole('radio', { name: 'After' }).click();
    await staff.page.getByRole('button', { name: 'Show 1:1 region' }).click();
    await expect
      .poll(() => staff.page.getByRole('img', { name: 'A region of the burn, one dot per screen pixel' }).count(), { timeout: 30_000 })
      .toBe(1);
    await expect.poll(() => staff.page.getByText(/^480 × 480 dots of 2340 × 1620 at 360 lines per inch/).count()).toBe(1);
    await staff.page.getByRole('button', { name: 'Save settings' }).click();
    await expect.poll(() => staff.page.getByText('Saved versions (1)').count()).toBe(1);
    await staff.page.waitForTimeout(500);
    await shot(staff.page, 'item-prep');
    await staff.page.getByRole('button', { name: 'Send proof to the buyer' }).click();
    // The server draws the proof from the original photo before sending it.
    await expect.poll(() => staff.page.getByText('Proof sent', { exact: true }).count(), { timeout: 20_000 }).toBe(1);

    const proofMail = await eventually(async () => {
      const newest = await mail.latestTo('june@buyers.test');
      return newest.subject.includes('your proof') ? newest : undefined;
    });
    const buyer = await b.newPage();
    await buyer.page.goto(proofMail.links.find((l) => l.includes('/proofs/'))!);
    await expect.poll(() => buyer.page.getByRole('img', { name: 'Your proof, as it will burn' }).count()).toBe(1);
    await buyer.page.waitForTimeout(500);
    await shot(buyer.page, 'proof');
    await buyer.page.getByRole('button', { name: 'Approve and engrave' }).click();
    // One click is not enough for something that cannot be undone: it asks once more.
    expect(await buyer.page.getByText('The studio will engrave exactly what the proof shows. Go ahead?').count()).toBe(1);
    await buyer.page.getByRole('button', { name: 'Yes, engrave it as shown' }).click();
    await expect.poll(() => buyer.page.getByText('Harbour Light Engraving will engrave it as shown.').count()).toBe(1);
    await staff.page.reload();
    await expect.poll(() => staff.page.getByText('Approved for engraving', { exact: true }).count()).toBe(1);
    expect([...staff.problems, ...buyer.problems]).toEqual([]);
  });

  it('staff render the approved item, download the engrave file and the job sheet, mark it burned and shipped', async () => {
    const staff = await b.newPage();
    await signInOnPage(staff.page, b.baseUrl, 'tobias@harbour-light.test', DEMO_PASSWORD, `${b.baseUrl}/studio/harbour-light`);
    await staff.page.getByRole('navigation', { name: 'Workspace' }).getByRole('link', { name: 'Production' }).click();
    await expect
      .poll(() => staff.page.getByRole('heading', { name: 'Black-backed (painted) glass · Workshop CO2, 100 W' }).count())
      .toBe(1);
    await shot(staff.page, 'production');
    await staff.page.getByRole('button', { name: 'Start a batch of 1 item' }).click();
    await staff.page.waitForURL(/\/production\/batches\//);
    // The render runs as a background job; the page follows its progress until the files are ready.
    await expect.poll(() => staff.page.getByRole('heading', { name: /^Batch \d+$/ }).count()).toBe(1);
    await expect.poll(() => staff.page.getByRole('progressbar').getAttribute('aria-valuenow'), { timeout: 60_000 }).toBe('100');
    await expect.poll(() => staff.page.getByRole('button', { name: /^Download engrave file/ }).count()).toBe(1);
    await shot(staff.page, 'batch-rendered');

    const engrave = await downloadFrom(staff.page, /^Download engrave file/);
    // Read by Pillow: bit depth 1 (mode '1') at the recipe's 360 lines per inch (PNG pHYs).
    const info = pillowImageInfo(engrave.bytes);
    expect(info).toMatchObject({ format: 'PNG', mode: '1' });
    expect(info.dpi![0]).toBeCloseTo(360, 1);
    expect(engrave.name).toMatch(/^order-\d+-[0-9a-f]{8}-engrave\.png$/);
    const sheet = await downloadFrom(staff.page, /^Download job sheet/);
    expect(pdfText(sheet.bytes)).toContain('Before you burn');
    writeFileSync(join(screenshotDir, 'job-sheet.pdf'), sheet.bytes);

    await staff.page.getByRole('button', { name: 'Mark burned' }).click();
    await expect.poll(() => staff.page.getByText(`Order ${orderNumber}: marked burned.`).count()).toBe(1);
    await staff.page.getByRole('link', { name: `Order ${orderNumber}` }).click();
    await staff.page.getByLabel('Carrier').fill('Parcelway');
    await staff.page.getByLabel('Tracking number').fill('PW 7781 2290');
    await staff.page.getByRole('button', { name: 'Mark shipped and tell the buyer' }).click();
    await expect.poll(() => staff.page.getByText('Complete', { exact: true }).count()).toBe(1);
    await expect.poll(() => staff.page.getByText(/^Shipped with Parcelway, tracking PW 7781 2290, on /).count()).toBe(1);
    await shot(staff.page, 'order-shipped');

    const shipped = await eventually(async () => {
      const newest = await mail.latestTo('june@buyers.test');
      return newest.subject.includes('has shipped') ? newest : undefined;
    });
    expect(shipped.subject).toBe(`Order ${orderNumber} has shipped`);
    expect(shipped.text).toContain('Tracking number: PW 7781 2290');
    expect(staff.problems).toEqual([]);
  });
});

/** Clicks a download button and answers the file the browser saved, with its suggested name. */
async function downloadFrom(page: Page, name: RegExp): Promise<{ name: string; bytes: Uint8Array }> {
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name }).click()]);
  const path = await download.path();
  return { name: download.suggestedFilename(), bytes: new Uint8Array(readFileSync(path)) };
}
