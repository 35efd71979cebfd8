import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startPaymentsFake, type PaymentsFake } from '#fakes/payments/server.ts';
import { startMailFake, type MailFake } from '#fakes/mail/server.ts';
import { createPayments } from '#server/adapters/payments.ts';
import { createMailer } from '#server/adapters/mailer.ts';
import { loadEnv } from '#server/env.ts';
import { screenshotDir, useBrowser } from '../support/browser.ts';
import { temporaryDataDir } from '../support/fakes.ts';

describe('pay page and inbox page of the local stand-ins, in Chromium', () => {
  const b = useBrowser();
  const paymentsData = temporaryDataDir('payments-browser');
  const mailData = temporaryDataDir('mail-browser');
  let payments: PaymentsFake;
  let mail: MailFake;

  beforeAll(async () => {
    payments = await startPaymentsFake({
      dataDir: paymentsData.dir,
      secretKeys: ['sk_test_browser'],
      merchantName: 'Harbour Light Engraving',
    });
    mail = await startMailFake({ dataDir: mailData.dir });
  });
  afterAll(async () => {
    await payments?.stop();
    await mail?.stop();
    paymentsData.remove();
    mailData.remove();
  });

  it('lets a person pay with the test card after a decline, and returns to the shop', async () => {
    const { stripe } = createPayments(loadEnv({ STRIPE_API_URL: payments.url, STRIPE_SECRET_KEY: 'sk_test_browser' }));
    const session = await stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [
        {
          quantity: 1,
          price_data: { currency: 'gbp', unit_amount: 5900, product_data: { name: 'Black-backed glass portrait, 8 × 10 in' } },
        },
      ],
      customer_email: 'ada@example.com',
      success_url: `${b.baseUrl}/?session={CHECKOUT_SESSION_ID}`,
      cancel_url: `${b.baseUrl}/`,
    });
    const { page, problems } = await b.newPage();
    await page.goto(session.url!);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Harbour Light Engraving');
    expect(await page.locator('.total').textContent()).toBe('£59.00');

    await page.getByLabel('Card number').fill('4000 0000 0000 0002');
    await page.getByLabel('Expiry (MM / YY)').fill('12 / 34');
    await page.getByLabel('Security code').fill('123');
    await page.getByLabel('Name on card').fill('Ada Example');
    await page.getByRole('button', { name: /^Pay/ }).click();
    await expect.poll(() => page.getByRole('alert').textContent()).toBe('Refused: this card was not accepted. Nothing was charged.');
    await page.screenshot({ path: join(screenshotDir, 'pay-page-declined.png'), fullPage: true });

    await page.getByLabel('Card number').fill('4242 4242 4242 4242');
    await page.getByLabel('Expiry (MM / YY)').fill('12 / 34');
    await page.getByLabel('Security code').fill('123');
    await page.getByLabel('Name on card').fill('Ada Example');
    await page.getByRole('button', { name: /^Pay/ }).click();
    await page.waitForURL(`${b.baseUrl}/?session=${session.id}`);
    expect((await stripe.checkout.sessions.retrieve(session.id)).payment_status).toBe('paid');
    // The declined attempt answers 402 Payment Required, which the browser reports on its console.
    expect(problems.filter((p) => !p.includes('status of 402'))).toEqual([]);
    await page.close();
  });

  it('lets a person read a message in the inbox and follow its link', async () => {
    const mailer = createMailer(loadEnv({ SMTP_URL: mail.smtpUrl }));
    await mailer.send({
      to: 'ada@example.com',
      subject: 'Your order is on its way',
      text: `Track it here: ${b.baseUrl}/s/harbour-light`,
      html: `<h1>On its way</h1><p><a href="${b.baseUrl}/s/harbour-light">Open the storefront</a></p>`,
    });
    mailer.close();
    const { page, problems } = await b.newPage();
    await page.goto(mail.url);
    await page.getByRole('link', { name: 'Your order is on its way' }).click();
    const message = page.frameLocator('iframe[title="Message"]');
    await expect.poll(() => message.getByRole('heading').textContent()).toBe('On its way');
    await page.screenshot({ path: join(screenshotDir, 'mail-inbox-message.png'), fullPage: true });
    await message.getByRole('link', { name: 'Open the storefront' }).click();
    await page.waitForURL(`${b.baseUrl}/s/harbour-light`);
    expect(problems).toEqual([]);
    await page.close();
  });
});
