import { createServer, type Server } from 'node:http';
import sharp from 'sharp';
import request from 'supertest';
import type Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { Blank, BlankSize } from '#server/features/catalog/catalog.entity.ts';
import { OutboxEmail } from '#server/features/outbox/outbox-email.entity.ts';
import { BuyerPhoto } from '#server/features/photos/buyer-photo.entity.ts';
import { Order, OrderEvent } from '#server/features/orders/order.entity.ts';
import { ShippingRate } from '#server/features/shipping/shipping-rate.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { eventually } from '../support/fakes.ts';
import { postSignedEvent, usePaymentsFake } from '../support/payments.ts';
import { useTestApp } from '../support/test-app.ts';
import { agentFor, createMember, createUser } from '../support/factories.ts';
import { fillCrop } from '../support/orders.ts';
import { orientedArea } from '#shared/imaging/sizing.ts';

/**
 * From a photo to a paid order on the demo studio (USD, inches): uploads, pricing from the
 * catalog alone, the payment webhook and its edge cases. Payments go through the payments
 * stand-in, whose signed webhooks reach the app over HTTP as in production.
 */
describe('checkout and payment', () => {
  const payments = usePaymentsFake();
  const t = useTestApp(() => payments.start());
  let server: Server;
  let studio: Studio;
  let glass: Blank;
  let small: BlankSize;
  let large: BlankSize;
  let rate: ShippingRate;
  const base = '/api/storefront/harbour-light';
  const scoped = () => {
    const em = t.orm.em.fork();
    em.setFilterParams(TENANT_FILTER, { studioId: studio.id });
    return em;
  };

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    server = createServer(t.app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const address = server.address();
    payments.connect(`http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`);
    const em = t.orm.em.fork();
    studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    em.setFilterParams(TENANT_FILTER, { studioId: studio.id });
    glass = await em.findOneOrFail(Blank, { name: 'Black-backed glass portrait' }, { populate: ['sizes'] });
    small = glass.sizes.getItems().find((s) => s.label === '5 × 7 in')!;
    large = glass.sizes.getItems().find((s) => s.label === '8 × 10 in')!;
    rate = (await em.find(ShippingRate, { studio }, { orderBy: { priceMinor: 'asc' } }))[0]!;
  });
  afterAll(() => new Promise((resolve) => server.close(resolve)));

  const jpeg = (width: number, height: number) =>
    sharp({ create: { width, height, channels: 3, background: '#6d7f8c' } })
      .jpeg()
      .toBuffer();

  /** Uploads as the designer does; answers the claim's response. */
  async function upload(bytes: Buffer, contentType = 'image/jpeg') {
    const ticket = (await request(t.app).post(`${base}/photo-uploads`).send({ contentType, contentLength: bytes.length }).expect(201)).body;
    expect((await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(bytes) })).status).toBe(200);
    return request(t.app).post(`${base}/buyer-photos`).send({ key: ticket.key });
  }

  let photo: { id: string; width: number; height: number };
  beforeAll(async () => {
    // 3000 × 3800 px: over 300 pixels per inch at 8 × 10 in (7.5 × 9.5 in area).
    photo = (await upload(await jpeg(3000, 3800))).body;
  });

  const item = (size: BlankSize, extra: Record<string, unknown> = {}) => ({
    blankId: glass.id,
    sizeId: size.id,
    orientation: 'portrait',
    quantity: 1,
    photoId: photo.id,
    placement: {
      crop: fillCrop(photo, orientedArea(size, (extra.orientation as 'portrait' | 'landscape' | undefined) ?? 'portrait')),
      rotation: 0,
    },
    rightsConfirmed: true,
    ...extra,
  });
  const checkout = (items: unknown[], extra: Record<string, unknown> = {}) =>
    request(t.app)
      .post(`${base}/orders`)
      .send({
        items,
        buyer: { email: 'june@buyers.test', name: 'June Aldous' },
        delivery: {
          method: 'ship',
          rateId: rate.id,
          address: { line1: '3 Orchard Row', city: 'Kettleby', postalCode: 'KB1 2CD', country: 'gb' },
        },
        ...extra,
      });
  const orderOf = (id: string) => scoped().findOneOrFail(Order, { id }, { populate: ['items', 'events'] });

  it('checks the photo on arrival and answers its size, preview and quality', () => {
    expect(photo).toMatchObject({ width: 3000, height: 3800, previewWidth: 1263, previewHeight: 1600 });
    expect((photo as unknown as { quality: { blurry: boolean } }).quality.blurry).toBe(true); // a flat grey photo has no detail at all
  });

  it('prices the order from the catalog, whatever the client says about money', async () => {
    const res = await checkout([{ ...item(large, { quantity: 2 }), priceMinor: 1, unitPrice: 1 }], {
      total: 1,
      totalMinor: 1,
      shippingMinor: 0,
    }).expect(201);
    const order = await orderOf(res.body.orderId);
    // 2 × $69.00 + $8.95 tracked post, from the demo catalog and rates.
    expect(order).toMatchObject({ status: 'awaiting_payment', subtotalMinor: 13800, shippingMinor: 895, totalMinor: 14695 });
    const session = await t.payments.stripe.checkout.sessions.retrieve(order.checkoutSessionId!);
    expect(session.amount_total).toBe(14695);
    expect(res.body.paymentUrl).toBe(session.url);
  });

  it('numbers orders from the number the owner chose, and never back to one already used', async () => {
    const owner = await agentFor(t.app, (await createMember(t.orm.em.fork(), studio, 'owner')).user);
    const settings = (await owner.get('/api/studios/harbour-light').expect(200)).body.orders;
    const highest = (await scoped().find(Order, { studio }, { orderBy: { number: 'desc' }, limit: 1 }))[0]!.number;
    const refused = await owner
      .put('/api/studios/harbour-light/settings/orders')
      .send({ ...settings, nextOrderNumber: highest })
      .expect(400);
    expect(refused.body.issues).toEqual([{ path: ['nextOrderNumber'], message: `Use ${highest + 1} or more: order ${highest} exists.` }]);
    await owner
      .put('/api/studios/harbour-light/settings/orders')
      .send({ ...settings, nextOrderNumber: highest + 50 })
      .expect(200);
    const first = await orderOf((await checkout([item(small)]).expect(201)).body.orderId);
    const second = await orderOf((await checkout([item(small)]).expect(201)).body.orderId);
    expect([first.number, second.number]).toEqual([highest + 50, highest + 51]);
  });

  it('on payment: marks the order paid, takes the stock, queues both e-mails; a second delivery pays once', async () => {
    const before = (await scoped().findOneOrFail(BlankSize, { id: small.id })).stock!;
    const res = await checkout([item(small)]).expect(201);
    expect(await payments.pay(res.body.paymentUrl)).toBe(303);
    const order = await eventually(async () => {
      const o = await orderOf(res.body.orderId);
      return o.status === 'paid' ? o : undefined;
    });
    expect(order.items.getItems().map((i) => i.stage)).toEqual(['photo_review']);
    expect((await scoped().findOneOrFail(BlankSize, { id: small.id })).stock).toBe(before - 1);
    const mails = await t.orm.em.fork().find(OutboxEmail, { subject: { $like: `%${order.number}%` } });
    expect(mails.map((m) => m.to).sort()).toEqual(['hello@harbour-light.test', 'june@buyers.test']);
    const buyerMail = mails.find((m) => m.to === 'june@buyers.test')!;
    const link = /(http\S+\/orders\/\S+)/.exec(buyerMail.text)![1]!;
    await request(t.app)
      .get(new URL(link).pathname + new URL(link).search)
      .expect(200);

    // The provider delivers the same event again: nothing changes.
    const events = await t.payments.stripe.events.list({ type: 'checkout.session.completed' });
    const event = events.data.find((e) => (e.data.object as Stripe.Checkout.Session).id === order.checkoutSessionId)!;
    await payments.redeliver(event.id);
    expect((await scoped().findOneOrFail(BlankSize, { id: small.id })).stock).toBe(before - 1);
    expect((await orderOf(order.id)).events.getItems().filter((e) => e.type === 'paid')).toHaveLength(1);
  });

  /** A webhook the app receives as from the provider, signed with its secret. */
  const signedWebhook = (event: object, secret?: string) => postSignedEvent(t, event, secret);

  it('ignores an expiry that arrives after the payment', async () => {
    const res = await checkout([item(small)]).expect(201);
    await payments.pay(res.body.paymentUrl);
    const order = await eventually(async () =>
      (await orderOf(res.body.orderId)).status === 'paid' ? orderOf(res.body.orderId) : undefined,
    );
    const session = await t.payments.stripe.checkout.sessions.retrieve(order.checkoutSessionId!);
    const late = await signedWebhook({
      id: 'evt_late_expiry_1',
      object: 'event',
      type: 'checkout.session.expired',
      data: { object: { ...session, status: 'expired' } },
    }).expect(200);
    expect(late.body.outcome).toBe('ignored');
    expect((await orderOf(order.id)).status).toBe('paid');
  });

  it('releases an order whose time to pay ran out', async () => {
    const res = await checkout([item(small)]).expect(201);
    const order = await orderOf(res.body.orderId);
    const session = await t.payments.stripe.checkout.sessions.retrieve(order.checkoutSessionId!);
    expect(
      (
        await signedWebhook({
          id: 'evt_expiry_2',
          object: 'event',
          type: 'checkout.session.expired',
          data: { object: { ...session, status: 'expired' } },
        }).expect(200)
      ).body.outcome,
    ).toBe('handled');
    const released = await orderOf(order.id);
    expect(released.status).toBe('cancelled');
    expect(released.items.getItems().map((i) => i.stage)).toEqual(['cancelled']);
    // The receipt that waited for the payment goes with the order: the buyer hears nothing.
    expect(await t.orm.em.fork().count(OutboxEmail, { heldForOrder: order.id })).toBe(0);
    expect(await t.orm.em.fork().count(OutboxEmail, { subject: { $like: `%order ${order.number} %` } })).toBe(0);
  });

  it('writes the receipt with its private link at checkout and sends it only when the payment arrives', async () => {
    const res = await checkout([item(small)]).expect(201);
    const order = await orderOf(res.body.orderId);
    const receipt = () =>
      t.orm.em.fork().findOneOrFail(OutboxEmail, { to: 'june@buyers.test', subject: { $like: `%order ${order.number} %` } });
    const held = await receipt();
    expect(held).toMatchObject({ status: 'held', heldForOrder: order.id });
    // Sent in the studio's name, answered to the studio's contact address.
    expect(held).toMatchObject({ fromName: 'Harbour Light Engraving', replyTo: 'hello@harbour-light.test' });
    expect(held.text).toContain('Delivery: Tracked post, 3–5 working days, $8.95');
    expect(held.text).toContain('Questions? Write to hello@harbour-light.test');
    // The link in it is the one the pay page returns to: the same key, built once at checkout.
    const link = /https?:\/\/\S+\/orders\/\S+/.exec(held.text)![0];
    const session = await t.payments.stripe.checkout.sessions.retrieve(order.checkoutSessionId!);
    expect(session.success_url).toBe(`${link}&paid=1`);
    expect(await payments.pay(res.body.paymentUrl)).toBe(303);
    await eventually(async () => ((await receipt()).status === 'held' ? undefined : true));
    expect(await receipt()).toMatchObject({ status: expect.stringMatching(/^(pending|sent)$/), heldForOrder: null });
  });

  it('refunds a payment that arrives after its order lapsed (events out of order), once', async () => {
    const res = await checkout([item(small)]).expect(201);
    const order = await orderOf(res.body.orderId);
    const session = await t.payments.stripe.checkout.sessions.retrieve(order.checkoutSessionId!);
    await signedWebhook({
      id: 'evt_expiry_first_3',
      object: 'event',
      type: 'checkout.session.expired',
      data: { object: { ...session, status: 'expired' } },
    }).expect(200);
    const stockBefore = (await scoped().findOneOrFail(BlankSize, { id: small.id })).stock;
    // The payment's own event comes after the expiry.
    await payments.pay(res.body.paymentUrl);
    const lapsed = await eventually(async () => {
      const now = await orderOf(order.id);
      return now.refundedMinor ? now : undefined;
    });
    expect(lapsed.status).toBe('cancelled');
    expect(lapsed.refundedMinor).toBe(lapsed.totalMinor);
    expect(lapsed.note).toMatch(/arrived after this order had lapsed, so it was refunded in full/);
    // The provider's own record: one charge.refunded event for this payment, for the whole amount.
    const refundsOf = async () =>
      (await t.payments.stripe.events.list({ type: 'charge.refunded' })).data
        .map((e) => e.data.object as Stripe.Charge)
        .filter((c) => c.payment_intent === lapsed.paymentIntentId);
    expect((await refundsOf()).map((c) => c.amount_refunded)).toEqual([lapsed.totalMinor]);
    // Delivered again: still one refund, no stock taken, nothing paid.
    const events = await t.payments.stripe.events.list({ type: 'checkout.session.completed' });
    await payments.redeliver(events.data.find((e) => (e.data.object as Stripe.Checkout.Session).id === session.id)!.id);
    expect(await refundsOf()).toHaveLength(1);
    expect((await orderOf(order.id)).events.getItems().filter((e) => e.type === 'late_payment_refunded')).toHaveLength(1);
    expect((await scoped().findOneOrFail(BlankSize, { id: small.id })).stock).toBe(stockBefore);
  });

  it('leaves the order unpaid after a declined card, and records the attempt', async () => {
    const res = await checkout([item(small)]).expect(201);
    expect(await payments.pay(res.body.paymentUrl, '4000 0000 0000 0002')).toBe(402); // the documented generic decline card
    await eventually(async () =>
      (await orderOf(res.body.orderId)).events.getItems().some((e) => e.type === 'payment_failed') ? true : undefined,
    );
    expect((await orderOf(res.body.orderId)).status).toBe('awaiting_payment');
  });

  it('refuses a webhook with a wrong signature and changes nothing', async () => {
    const res = await checkout([item(small)]).expect(201);
    const order = await orderOf(res.body.orderId);
    const forged = {
      id: 'evt_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: {
        object: { id: order.checkoutSessionId, object: 'checkout.session', payment_status: 'paid', metadata: { orderId: order.id } },
      },
    };
    expect((await signedWebhook(forged, 'whsec_not_the_secret').expect(400)).body.code).toBe('BAD_REQUEST');
    await request(t.app).post('/api/payments/webhook').set('content-type', 'application/json').send(JSON.stringify(forged)).expect(400);
    expect((await orderOf(order.id)).status).toBe('awaiting_payment');
  });

  it('refunds and cancels an order whose blank sold out while the buyer paid', async () => {
    await scoped().nativeUpdate(BlankSize, { id: large.id }, { stock: 1 });
    const first = await checkout([item(large)]).expect(201);
    const second = await checkout([item(large)], { buyer: { email: 'sam@buyers.test', name: 'Sam Rook' } }).expect(201);
    await payments.pay(first.body.paymentUrl);
    await eventually(async () => ((await orderOf(first.body.orderId)).status === 'paid' ? true : undefined));
    await payments.pay(second.body.paymentUrl);
    const late = await eventually(async () => {
      const o = await orderOf(second.body.orderId);
      return o.status === 'cancelled' ? o : undefined;
    });
    expect(late.note).toMatch(/sold out while you were paying/);
    expect((await scoped().findOneOrFail(BlankSize, { id: large.id })).stock).toBe(0);
    const refunded = await t.payments.stripe.events.list({ type: 'charge.refunded' });
    const charge = refunded.data.map((e) => e.data.object as Stripe.Charge).find((c) => c.payment_intent === late.paymentIntentId);
    expect(charge?.amount_refunded).toBe(late.totalMinor);
    expect(await t.orm.em.fork().count(OutboxEmail, { to: 'sam@buyers.test', subject: { $like: '%sold out%' } })).toBe(1);
    // And checkout now says so up front.
    expect((await checkout([item(large)]).expect(400)).body.message).toMatch(/sold out/);
    await scoped().nativeUpdate(BlankSize, { id: large.id }, { stock: 12 });
  });

  it('refuses a framing whose proportions differ from the area’s by more than 0.5 %, rather than stretch it', async () => {
    const area = orientedArea(small, 'portrait');
    const fill = fillCrop(photo, area);
    // 1.5 times too wide: placed with the old resize it came out distorted.
    const refused = await checkout([item(small, { placement: { crop: { ...fill, width: fill.width * 1.5 } } })]).expect(400);
    expect(refused.body.issues[0].path).toEqual(['items', 0, 'placement']);
    expect(refused.body.message).toMatch(/does not have the proportions of the .* engraving area, so it would burn stretched/);
    // 0.6 % off is refused, 0.4 % taken (a designer's window is exact to a hundredth of a pixel).
    await checkout([item(small, { placement: { crop: { ...fill, width: fill.width * 1.006 } } })]).expect(400);
    await checkout([item(small, { placement: { crop: { ...fill, width: fill.width * 1.004 } } })]).expect(201);
  });

  it('says when a photo is too low in resolution, suggests a size, and takes it only once confirmed', async () => {
    const lowRes = await upload(await jpeg(320, 240));
    expect(lowRes.status).toBe(201);
    const low = lowRes.body;
    const lowItem = item(small, {
      photoId: low.id,
      orientation: 'landscape',
      placement: { crop: fillCrop(low, orientedArea(small, 'landscape')) },
    });
    const refused = await checkout([lowItem]).expect(400);
    expect(refused.body.issues[0].path).toEqual(['items', 0, 'lowResolutionConfirmed']);
    // 320 px across 6.5 in is 49 pixels per inch; no offered size reaches 150.
    expect(refused.body.message).toMatch(/only 49 pixels per inch at 6\.5 × 4\.5 in.*upload a larger photo/);
    await checkout([{ ...lowItem, lowResolutionConfirmed: true }]).expect(201);
    await scoped().nativeUpdate(Studio, { id: studio.id }, { lowResolutionPolicy: 'refuse' });
    expect((await checkout([{ ...lowItem, lowResolutionConfirmed: true }]).expect(400)).body.issues[0].path).toEqual([
      'items',
      0,
      'photoId',
    ]);
    await scoped().nativeUpdate(Studio, { id: studio.id }, { lowResolutionPolicy: 'confirm' });
  });

  it('opens the order page only with the key from the private link', async () => {
    const res = await checkout([item(small)]).expect(201);
    const key = new URL(res.body.paymentUrl).pathname; // not the key: anything else must fail
    await request(t.app).get(`${base}/orders/${res.body.orderId}`).expect(404);
    await request(t.app)
      .get(`${base}/orders/${res.body.orderId}?key=${encodeURIComponent(key)}`)
      .expect(404);
    const session = await t.payments.stripe.checkout.sessions.retrieve((await orderOf(res.body.orderId)).checkoutSessionId!);
    const page = await request(t.app)
      .get(new URL(session.success_url!).pathname.replace('/s/', '/api/storefront/') + new URL(session.success_url!).search)
      .expect(200);
    expect(page.body).toMatchObject({ status: 'awaiting_payment', total: '$57.95', delivery: { label: 'Tracked post, 3–5 working days' } });
    // The buyer reads the steps that concern them, in the studio's words: no staff names, no
    // internal work such as saved prep versions.
    const em = scoped();
    const order = await em.findOneOrFail(Order, { id: res.body.orderId });
    em.create(OrderEvent, { studio, order, type: 'photo_approved', actor: 'Tobias Wren', text: 'Photo approved by Tobias Wren.' });
    em.create(OrderEvent, { studio, order, type: 'prep_saved', actor: 'Tobias Wren', text: 'Prep version 1 saved by Tobias Wren.' });
    await em.flush();
    const again = await request(t.app)
      .get(new URL(session.success_url!).pathname.replace('/s/', '/api/storefront/') + new URL(session.success_url!).search)
      .expect(200);
    expect(again.body.events.map((e: { text: string }) => e.text)).toEqual([
      'Order placed.',
      'Your photo was checked: it will engrave well.',
    ]);
  });

  it('keeps what was ordered when the catalog changes afterwards', async () => {
    const res = await checkout([item(small)]).expect(201);
    const em = scoped();
    await em.nativeUpdate(BlankSize, { id: small.id }, { priceMinor: 9900, label: '5 × 7 in, new' });
    await em.nativeUpdate(Blank, { id: glass.id }, { name: 'Renamed portrait' });
    const order = await orderOf(res.body.orderId);
    const [line] = order.items.getItems();
    expect(line).toMatchObject({
      unitPriceMinor: 4900,
      snapshot: {
        blank: { name: 'Black-backed glass portrait' },
        size: { label: '5 × 7 in', priceMinor: 4900 },
        recipe: { linesPerInch: 360, speed: 5 },
      },
    });
    expect(order.totalMinor).toBe(4900 + 895);
    await em.nativeUpdate(BlankSize, { id: small.id }, { priceMinor: 4900, label: '5 × 7 in' });
    await em.nativeUpdate(Blank, { id: glass.id }, { name: 'Black-backed glass portrait' });
  });

  it('lists a signed-in buyer’s orders by their confirmed address, and opens them without the key', async () => {
    const res = await checkout([item(small)], { buyer: { email: 'robin@buyers.test', name: 'Robin Vale' } }).expect(201);
    const robin = await agentFor(t.app, await createUser(t.orm.em.fork(), { email: 'robin@buyers.test' }));
    const mine = (await robin.get('/api/me/orders').expect(200)).body;
    expect(mine.orders.map((o: { id: string }) => o.id)).toEqual([res.body.orderId]);
    expect(mine.orders[0]).toMatchObject({ studio: { slug: 'harbour-light' }, total: '$57.95' });
    await robin.get(`${base}/orders/${res.body.orderId}`).expect(200);
    // Someone else, signed in, gets nothing.
    const other = await agentFor(t.app, await createUser(t.orm.em.fork()));
    expect((await other.get('/api/me/orders').expect(200)).body.orders).toEqual([]);
    await other.get(`${base}/orders/${res.body.orderId}`).expect(404);
  });

  describe('uploads that need converting: taken, as 8-bit sRGB', () => {
    it.each([
      [
        'a CMYK JPEG',
        async () =>
          sharp({ create: { width: 1200, height: 900, channels: 3, background: '#336699' } })
            .toColourspace('cmyk')
            .jpeg()
            .toBuffer(),
        'jpeg',
      ],
      [
        'a 16-bit PNG',
        async () =>
          sharp({ create: { width: 1000, height: 800, channels: 3, background: '#996633' } })
            .toColourspace('rgb16')
            .png()
            .toBuffer(),
        'png',
      ],
      // 40 MP: within the 100 MP limit, decoded once and kept whole for production.
      [
        'a 40-megapixel JPEG',
        async () =>
          sharp({ create: { width: 8000, height: 5000, channels: 3, background: '#557788' } })
            .jpeg({ quality: 70 })
            .toBuffer(),
        'jpeg',
      ],
    ])(
      'accepts %s and says what it is',
      async (_what, make, format) => {
        const bytes = await make();
        // The independent reading first: what the file says it is (sharp's libvips header reader).
        const meta = await sharp(bytes).metadata();
        const res = await upload(bytes, format === 'png' ? 'image/png' : 'image/jpeg');
        expect(res.status).toBe(201);
        expect(res.body).toMatchObject({ width: meta.width, height: meta.height });
        const preview = await request(t.app)
          .get(res.body.previewUrl)
          .buffer(true)
          .parse((r, done) => {
            const chunks: Buffer[] = [];
            r.on('data', (c: Buffer) => chunks.push(c));
            r.on('end', () => done(null, Buffer.concat(chunks)));
          })
          .expect(200);
        // The preview the designer draws from is 8-bit sRGB whatever came in.
        expect(await sharp(preview.body as Buffer).metadata()).toMatchObject({ format: 'webp', space: 'srgb', depth: 'uchar' });
      },
      60_000,
    );
  });

  describe('uploads that cannot be used: a clear 4xx and no photo kept', () => {
    it('refuses a ticket for an empty file', async () => {
      expect(
        (await request(t.app).post(`${base}/photo-uploads`).send({ contentType: 'image/jpeg', contentLength: 0 }).expect(400)).body
          .issues[0].path,
      ).toEqual(['contentLength']);
    });

    const photoCount = () => scoped().count(BuyerPhoto, {});
    it.each([
      ['a PDF', 'application/pdf', 1000, 'contentType'],
      ['a file over 25 MB', 'image/jpeg', 26 * 1024 * 1024, 'contentLength'],
    ])('refuses a ticket for %s', async (_what, contentType, contentLength, field) => {
      expect(
        (await request(t.app).post(`${base}/photo-uploads`).send({ contentType, contentLength }).expect(400)).body.issues[0].path,
      ).toEqual([field]);
    });

    it.each([
      ['a damaged JPEG', async () => (await jpeg(800, 600)).subarray(0, 400), 400, /damaged/],
      // A PNG header declaring 100 000 × 100 000 pixels: refused from the header, never decoded.
      ['a decompression bomb', async () => bombPng(), 413, /more pixels than we accept/],
      ['a HEIC photo', async () => heicHeader(), 415, /HEIC/],
      ['a text file', async () => Buffer.from('not a photo, just words '.repeat(10)), 415, /JPEG, PNG/],
      ['a text file named .jpg', async () => Buffer.from('Dear studio, here is my photo. '.repeat(8)), 415, /JPEG, PNG/],
      [
        'an SVG with a script',
        async () =>
          Buffer.from(
            '<svg xmlns="http://www.w3.org/2000/svg" width="800" height="600" onload="alert(1)"><script>alert(1)</script><rect width="800" height="600"/></svg>',
          ),
        415,
        /JPEG, PNG/,
      ],
      [
        'an HTML page',
        async () => Buffer.from('<!doctype html><html><body><script>alert(1)</script><img src=x></body></html>'),
        415,
        /JPEG, PNG/,
      ],
      // A ZIP's local file header (PKWARE APPNOTE 4.3.7): "PK\x03\x04".
      ['a ZIP archive', async () => Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.alloc(200, 1)]), 415, /JPEG, PNG/],
      [
        'an animated GIF',
        async () =>
          sharp([await jpeg(64, 64), await jpeg(64, 64)], { join: { animated: true } })
            .gif()
            .toBuffer(),
        415,
        /JPEG, PNG/,
      ],
      // The first bytes of a JPEG (SOI, APP0) and nothing after: not a picture at all.
      ['a JPEG cut after its first bytes', async () => (await jpeg(800, 600)).subarray(0, 20), 400, /damaged/],
    ])('refuses %s', async (_what, make, status, message) => {
      const before = await photoCount();
      const res = await upload(await make());
      expect(res.status).toBe(status);
      expect(res.body.message).toMatch(message);
      expect(await photoCount()).toBe(before);
    });
  });
});

/** A valid PNG signature and IHDR for a 100 000 × 100 000 image, with a tiny IDAT. */
function bombPng(): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (buf: Buffer) => {
    let c = 0xffffffff;
    for (const b of buf) c = crcTable[(c ^ b) & 0xff]! ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
    const out = Buffer.alloc(8 + data.length + 4);
    out.writeUInt32BE(data.length, 0);
    body.copy(out, 4);
    out.writeUInt32BE(crc(body), 8 + data.length);
    return out;
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(100_000, 0);
  ihdr.writeUInt32BE(100_000, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 0; // gray
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', Buffer.from([0x78, 0x9c, 0x03, 0x00, 0x00, 0x00, 0x00, 0x01])),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** The start of a HEIC file: an ISO base media 'ftyp' box with the 'heic' brand (ISO/IEC 23008-12). */
function heicHeader(): Buffer {
  const box = Buffer.alloc(24);
  box.writeUInt32BE(24, 0);
  box.write('ftypheic', 4, 'latin1');
  box.write('mif1heic', 16, 'latin1');
  return Buffer.concat([box, Buffer.alloc(200)]);
}
