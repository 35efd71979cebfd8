import sharp from 'sharp';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { Blank, BlankSize } from '#server/features/catalog/catalog.entity.ts';
import { OutboxEmail } from '#server/features/outbox/outbox-email.entity.ts';
import { OrderItem } from '#server/features/orders/order.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { useTestApp } from '../support/test-app.ts';
import { fillCrop, uploadBuyerPhoto, placePaidOrder } from '../support/orders.ts';
import { signIn } from '../support/factories.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';

/** Staff review buyers' photos: the queue, approving, asking for a new one, the buyer's answer. */
describe('photo review', () => {
  const t = useTestApp();
  const store = '/api/storefront/harbour-light';
  const work = '/api/studios/harbour-light';
  let staff: ReturnType<typeof request.agent>;
  let owner: ReturnType<typeof request.agent>;
  let glass: Blank;
  let studio: Studio;

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    const em = t.orm.em.fork();
    studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    staff = request.agent(t.app);
    await signIn(staff, 'tobias@harbour-light.test', DEMO_PASSWORD);
    owner = request.agent(t.app);
    await signIn(owner, 'maren@harbour-light.test', DEMO_PASSWORD);
    glass = await em.findOneOrFail(
      Blank,
      { name: 'Black-backed glass portrait' },
      { populate: ['sizes', 'material'], filters: { [TENANT_FILTER]: { studioId: studio.id } } },
    );
  });

  const upload = (width: number, height: number) => uploadBuyerPhoto(t, 'harbour-light', width, height);

  /** A paid order for one 5 × 7 in portrait, as checkout and the payment webhook make it. */
  async function paidOrder(email: string) {
    const photo = await upload(1500, 2100);
    const size = glass.sizes.getItems().find((s) => s.label === '5 × 7 in')!;
    return placePaidOrder(t, 'harbour-light', [{ blankId: glass.id, sizeId: size.id, photo }], { email, name: 'Ivy Marsh' });
  }

  it('queues paid items oldest first; approving moves one to prep; moving it again is refused with what is allowed', async () => {
    const first = await paidOrder('ivy@buyers.test');
    const second = await paidOrder('ivy@buyers.test');
    const queue = (await staff.get(`${work}/review-queue`).expect(200)).body.items;
    expect(queue.map((i: { orderId: string }) => i.orderId)).toEqual([first, second]);
    // By hand: 1500 × 2100 px on a 4.5 × 6.5 in area is min(333, 323) = 323 pixels per inch, good.
    expect(queue[0]).toMatchObject({
      blankName: 'Black-backed glass portrait',
      sizeLabel: '5 × 7 in',
      effectivePpi: 323,
      verdict: 'good',
      inscription: null,
    });
    await staff.get(queue[0].photo.originalUrl).expect(200).expect('content-type', 'image/jpeg');
    await staff.post(`${work}/items/${queue[0].itemId}/approve-photo`).expect(200, { itemId: queue[0].itemId, stage: 'prep' });
    const again = await staff.post(`${work}/items/${queue[0].itemId}/approve-photo`).expect(409);
    expect(again.body.message).toMatch(/is prep and cannot become prep\. It can become: proof sent, approved, cancelled\./);
    expect((await staff.get(`${work}/review-queue`).expect(200)).body.items.map((i: { orderId: string }) => i.orderId)).toEqual([second]);
  });

  it('asks the buyer for a new photo with the reason; the buyer’s replacement puts the item back in review', async () => {
    const orderId = await paidOrder('nell@buyers.test');
    const item = (await staff.get(`${work}/review-queue`).expect(200)).body.items.find((i: { orderId: string }) => i.orderId === orderId);
    // As if the buyer had said "engrave it soft anyway" about the first photo.
    await t.orm.em.fork().nativeUpdate(OrderItem, { id: item.itemId }, { lowResolutionConfirmed: true }, { filters: false });
    await staff.post(`${work}/items/${item.itemId}/ask-new-photo`).send({ reason: 'sideways' }).expect(400);
    await staff
      .post(`${work}/items/${item.itemId}/ask-new-photo`)
      .send({ reason: 'blurry', note: 'The faces are soft; the original file would help.' })
      .expect(200, { itemId: item.itemId, stage: 'needs_new_photo' });
    const mail = await t.orm.em.fork().findOneOrFail(OutboxEmail, { to: 'nell@buyers.test', subject: { $like: '%needs a new photo%' } });
    expect(mail.text).toMatch(/Why: Blurred or out of focus\.\nFrom the studio: The faces are soft/);
    const token = /\/replace\/([\w-]+)/.exec(mail.text)![1]!;

    const asked = (await request(t.app).get(`${store}/replacements/${token}`).expect(200)).body;
    expect(asked).toMatchObject({
      blankName: 'Black-backed glass portrait',
      reason: 'Blurred or out of focus',
      note: 'The faces are soft; the original file would help.',
    });
    const better = await upload(1800, 2520);
    // The 5 × 7 in portrait's area is 4.5 × 6.5 in.
    const crop = fillCrop(better, { widthMm: 4.5 * 25.4, heightMm: 6.5 * 25.4 });
    await request(t.app).post(`${store}/replacements/${token}`).send({ photoId: better.id, placement: { crop } }).expect(400); // no permission ticked
    // The whole 1800 × 2520 photo is 3 % narrower than the area: it would burn stretched.
    const stretched = await request(t.app)
      .post(`${store}/replacements/${token}`)
      .send({ photoId: better.id, placement: { crop: { left: 0, top: 0, width: 1800, height: 2520 } }, rightsConfirmed: true })
      .expect(400);
    expect(stretched.body.message).toMatch(/would burn stretched/);
    await request(t.app)
      .post(`${store}/replacements/${token}`)
      .send({ photoId: better.id, placement: { crop }, rightsConfirmed: true })
      .expect(200, { stage: 'photo_review' });
    // The link is used up; the item is back in the queue with the new photo and its history.
    await request(t.app).get(`${store}/replacements/${token}`).expect(404);
    const back = (await staff.get(`${work}/review-queue`).expect(200)).body.items.find((i: { itemId: string }) => i.itemId === item.itemId);
    expect(back).toMatchObject({ replacements: 1, effectivePpi: 387, photo: { id: better.id } }); // min(1744.6 / 4.5, 2520 / 6.5): the window's own width
    // A good new photo: the old confirmation of a soft engraving no longer stands.
    expect(back.lowResolutionConfirmed).toBe(false);
    const order = (await staff.get(`${work}/orders/${orderId}`).expect(200)).body;
    expect(order.events.map((e: { text: string }) => e.text).join('\n')).toMatch(
      /New photo asked for by Tobias Renn: blurred or out of focus[\s\S]*The buyer sent a new photo/,
    );
    const stored = await t.orm.em
      .fork()
      .findOneOrFail(OrderItem, { id: item.itemId }, { filters: { [TENANT_FILTER]: { studioId: studio.id } } });
    expect(stored.replacementTokenHash).toBeNull();
  });

  it('searches, filters, sorts and pages orders on the server', async () => {
    await paidOrder('quinn@buyers.test');
    const byEmail = (await owner.get(`${work}/orders`).query({ search: 'QUINN@' }).expect(200)).body;
    expect(byEmail.orders.map((o: { buyerEmail: string }) => o.buyerEmail)).toEqual(['quinn@buyers.test']);
    const number = byEmail.orders[0].number;
    expect(
      (
        await owner
          .get(`${work}/orders`)
          .query({ search: `#${number}` })
          .expect(200)
      ).body.orders.map((o: { number: number }) => o.number),
    ).toEqual([number]);
    const inPrep = (await owner.get(`${work}/orders`).query({ stage: 'prep' }).expect(200)).body;
    expect(inPrep.orders.every((o: { items: Array<{ stage: string }> }) => o.items.some((i) => i.stage === 'prep'))).toBe(true);
    expect(
      (await owner.get(`${work}/orders`).query({ material: 'Black-backed (painted) glass' }).expect(200)).body.total,
    ).toBeGreaterThanOrEqual(4);
    expect((await owner.get(`${work}/orders`).query({ material: 'Walnut' }).expect(200)).body.total).toBe(0);
    const page = (await owner.get(`${work}/orders`).query({ pageSize: 5, page: 1, sort: 'oldest' }).expect(200)).body;
    expect(page).toMatchObject({ page: 1, pageSize: 5 });
    expect((await owner.get(`${work}/orders`).query({ from: 'yesterday' }).expect(400)).body.issues[0].path).toEqual(['from']);
    expect((await owner.get(`${work}/orders`).query({ from: '2099-01-01' }).expect(200)).body.total).toBe(0);
  });

  it('counts work by stage and sums orders and revenue after refunds per week', async () => {
    const body = (await staff.get(`${work}/today`).expect(200)).body;
    expect(body.weeks).toHaveLength(12);
    const inReview = (await staff.get(`${work}/review-queue`).expect(200)).body.items.length;
    expect(body.byStage.find((s: { stage: string }) => s.stage === 'photo_review').count).toBe(inReview);
    // Every order here was paid this week: the last week holds them all, at $49.00 each less refunds.
    const all = (await owner.get(`${work}/orders`).query({ pageSize: 100 }).expect(200)).body.orders;
    const paid = all.filter((o: { status: string }) => o.status !== 'awaiting_payment');
    const thisWeek = body.weeks.at(-1);
    expect(thisWeek.orders).toBe(paid.length);
    expect(thisWeek.revenueMinor).toBe(4900 * paid.length);
    expect(body.weeks.slice(0, -1).every((w: { orders: number }) => w.orders === 0)).toBe(true);
    expect(body.oldest.length).toBeGreaterThan(0);
  });

  it('preps with settings from the recipe, keeps each version, sends a proof the buyer answers by link', async () => {
    const orderId = await paidOrder('wren@buyers.test');
    const queued = (await staff.get(`${work}/review-queue`).expect(200)).body.items.find((i: { orderId: string }) => i.orderId === orderId);
    const itemUrl = `${work}/items/${queued.itemId}`;
    const inReview = (await staff.get(itemUrl).expect(200)).body;
    // Prep waits until the photo is approved.
    expect((await staff.put(`${itemUrl}/prep`).send(inReview.prep).expect(409)).body.message).toMatch(/only while it is being prepared/);
    await staff.post(`${itemUrl}/approve-photo`).expect(200);
    const item = (await staff.get(itemUrl).expect(200)).body;
    // The demo recipe for painted glass: 360 lines per inch, Jarvis–Judice–Ninke, negative.
    expect(item.prep).toMatchObject({ halftoneMethod: 'jarvis-judice-ninke', linesPerInch: 360, negative: true });
    expect(item.allowedMoves).toEqual(['proof_sent', 'approved', 'cancelled']);
    expect(
      (
        await staff
          .put(`${itemUrl}/prep`)
          .send({ ...item.prep, linesPerInch: 90 })
          .expect(400)
      ).body.issues[0].path,
    ).toEqual(['linesPerInch']);
    await staff
      .put(`${itemUrl}/prep`)
      .send({ ...item.prep, sharpenAmount: 220 })
      .expect(200, { version: 1 });
    await staff
      .put(`${itemUrl}/prep`)
      .send({ ...item.prep, sharpenAmount: 260, brightness: 8 })
      .expect(200, { version: 2 });
    const versions = (await staff.get(itemUrl).expect(200)).body.versions;
    expect(
      versions.map((v: { version: number; savedBy: string; settings: { sharpenAmount: number } }) => [
        v.version,
        v.savedBy,
        v.settings.sharpenAmount,
      ]),
    ).toEqual([
      [1, 'Tobias Renn', 220],
      [2, 'Tobias Renn', 260],
    ]);

    const proofLink = async () => {
      const mail = await t.orm.em
        .fork()
        .find(OutboxEmail, { to: 'wren@buyers.test', subject: { $like: '%your proof%' } }, { orderBy: { createdAt: 'desc' } });
      return /\/proofs\/([\w-]+)/.exec(mail[0]!.text)![1]!;
    };
    await staff.post(`${itemUrl}/send-proof`).expect(200, { stage: 'proof_sent' });
    await staff.put(`${itemUrl}/prep`).send(item.prep).expect(409); // not while the buyer looks at the proof
    const first = await proofLink();
    const proof = (await request(t.app).get(`${store}/proofs/${first}`).expect(200)).body;
    expect(proof.prep.sharpenAmount).toBe(260);
    // The proof picture is drawn on the server: a landscape of the area (here portrait, 4.5 in
    // wide) at 900 pixels across, with only the material's two colours inside the blank's
    // rounded shape and transparency outside it (the catalog's colours for painted glass).
    const picture = await request(t.app)
      .get(proof.imageUrl)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200)
      .expect('content-type', 'image/png');
    const { data, info } = await sharp(picture.body as Buffer)
      .raw()
      .toBuffer({ resolveWithObject: true });
    expect([info.width, info.height]).toEqual([900, Math.round((900 * 6.5) / 4.5)]);
    const colours = new Set<string>();
    for (let i = 0; i < data.length; i += 4)
      colours.add(
        data[i + 3] === 0 ? 'clear' : `#${[data[i]!, data[i + 1]!, data[i + 2]!].map((v) => v.toString(16).padStart(2, '0')).join('')}`,
      );
    expect([...colours].sort()).toEqual(['clear', glass.material.markColour, glass.material.surfaceColour].sort());
    await request(t.app).post(`${store}/proofs/${first}`).send({ decision: 'changes', message: '' }).expect(400);
    await request(t.app)
      .post(`${store}/proofs/${first}`)
      .send({ decision: 'changes', message: 'A little lighter, please.' })
      .expect(200, { stage: 'changes_requested' });
    await request(t.app).get(`${store}/proofs/${first}`).expect(404);
    await staff.post(`${itemUrl}/reopen-prep`).expect(200, { stage: 'prep' });
    await staff
      .put(`${itemUrl}/prep`)
      .send({ ...item.prep, brightness: 15 })
      .expect(200, { version: 3 });
    await staff.post(`${itemUrl}/send-proof`).expect(200);
    const second = await proofLink();
    expect(second).not.toBe(first);
    await request(t.app).post(`${store}/proofs/${second}`).send({ decision: 'approve' }).expect(200, { stage: 'approved' });
    const events = (await staff.get(`${work}/orders/${orderId}`).expect(200)).body.events.map((e: { text: string }) => e.text).join('\n');
    expect(events).toMatch(/asked for changes: “A little lighter, please\.”[\s\S]*The buyer approved the proof\./);
  });

  it('approves without a proof when the studio does not send one', async () => {
    const orderId = await paidOrder('ash@buyers.test');
    const queued = (await staff.get(`${work}/review-queue`).expect(200)).body.items.find((i: { orderId: string }) => i.orderId === orderId);
    await staff.post(`${work}/items/${queued.itemId}/approve-without-proof`).expect(409); // still in review
    await staff.post(`${work}/items/${queued.itemId}/approve-photo`).expect(200);
    // The demo studio sends proofs: skipping one needs the studio's setting.
    expect((await staff.post(`${work}/items/${queued.itemId}/approve-without-proof`).expect(409)).body.message).toMatch(
      /sends every buyer a proof/,
    );
    await t.orm.em.fork().nativeUpdate(Studio, { id: studio.id }, { proofsRequired: false });
    await staff.post(`${work}/items/${queued.itemId}/approve-without-proof`).expect(200, { stage: 'approved' });
    await t.orm.em.fork().nativeUpdate(Studio, { id: studio.id }, { proofsRequired: true });
  });

  describe('refunds and cancellations (owners only)', () => {
    it('refuses staff, refunds in part and then the rest, never more than was paid', async () => {
      const orderId = await paidOrder('rue@buyers.test');
      await staff.post(`${work}/orders/${orderId}/refunds`).send({ amountMinor: 500, reason: 'Chipped corner.' }).expect(403);
      await owner.post(`${work}/orders/${orderId}/refunds`).send({ amountMinor: 500 }).expect(400);
      expect(
        await owner
          .post(`${work}/orders/${orderId}/refunds`)
          .send({ amountMinor: 1000, reason: 'A small chip on one corner.' })
          .expect(200),
      ).toMatchObject({ body: { status: 'paid', refundedMinor: 1000 } });
      // $49.00 paid, $10.00 back: at most $39.00 is left.
      expect(
        (await owner.post(`${work}/orders/${orderId}/refunds`).send({ amountMinor: 4000, reason: 'Too much.' }).expect(400)).body.issues[0],
      ).toEqual({ path: ['amountMinor'], message: 'At most $39.00.' });
      expect((await owner.post(`${work}/orders/${orderId}/refunds`).send({ reason: 'The buyer sent it back.' }).expect(200)).body).toEqual({
        status: 'refunded',
        refundedMinor: 4900,
      });
      const refunds = await t.payments.stripe.events.list({ type: 'charge.refunded' });
      const order = (await owner.get(`${work}/orders/${orderId}`).expect(200)).body;
      const charge = refunds.data
        .map((e) => e.data.object as { payment_intent: string; amount_refunded: number })
        .filter((c) => c.payment_intent === order.paymentIntentId);
      expect(Math.max(...charge.map((c) => c.amount_refunded))).toBe(4900);
      expect(order.events.map((e: { text: string }) => e.text).join('\n')).toMatch(
        /Refunded in part: \$10\.00, by Maren Quist[\s\S]*Refunded in full: \$39\.00/,
      );
      expect(await t.orm.em.fork().count(OutboxEmail, { to: 'rue@buyers.test', subject: { $like: '%refunded' } })).toBe(2);
      await owner.post(`${work}/orders/${orderId}/refunds`).send({ reason: 'Again.' }).expect(409);
    });

    it('cancels before production, refunding and returning the stock; not once an item is on the machine', async () => {
      const stockOf = async () =>
        (
          await t.orm.em
            .fork()
            .findOneOrFail(BlankSize, { label: '5 × 7 in', blank: glass.id }, { filters: { [TENANT_FILTER]: { studioId: studio.id } } })
        ).stock;
      const before = await stockOf();
      const orderId = await paidOrder('sol@buyers.test');
      expect(await stockOf()).toBe(before! - 1);
      expect(
        (await owner.post(`${work}/orders/${orderId}/cancel`).send({ reason: 'The buyer asked to cancel.' }).expect(200)).body,
      ).toEqual({ status: 'cancelled', refundedMinor: 4900 });
      expect(await stockOf()).toBe(before);
      await owner.post(`${work}/orders/${orderId}/cancel`).send({ reason: 'Twice.' }).expect(409);
      const burning = await paidOrder('sol@buyers.test');
      await t.orm.em
        .fork()
        .nativeUpdate(OrderItem, { order: burning }, { stage: 'in_production' }, { filters: { [TENANT_FILTER]: { studioId: studio.id } } });
      expect((await owner.post(`${work}/orders/${burning}/cancel`).send({ reason: 'Too late.' }).expect(409)).body.message).toMatch(
        /already in production: the order can be refunded but no longer cancelled/,
      );
    });
  });
});
