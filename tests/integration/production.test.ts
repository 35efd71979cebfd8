import sharp from 'sharp';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { AuditEntry } from '#server/features/audit/audit-entry.entity.ts';
import { Blank } from '#server/features/catalog/catalog.entity.ts';
import { OutboxEmail } from '#server/features/outbox/outbox-email.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import type { BatchView, ProductionBoard } from '#shared/schemas/production.ts';
import { SPEED_UNIT_LABELS } from '#shared/schemas/catalog.ts';
import { burnEstimateLine } from '#server/features/production/render.service.ts';
import { signIn } from '../support/factories.ts';
import { placePaidOrder, uploadBuyerPhoto } from '../support/orders.ts';
import { pdfFirstPageQr, pdfPages, pdfText } from '../support/pdf.ts';
import { pillowImageInfo, pillowOpen, unpackBits } from '../support/pillow.ts';
import { useTestApp } from '../support/test-app.ts';

/** From approved items to shipped: batches, renders with their files, burned, handed over. */
describe('production and shipping', () => {
  const t = useTestApp({}, { worker: true });
  const work = '/api/studios/harbour-light';
  let staff: ReturnType<typeof request.agent>;
  let glass: Blank;
  let maple: Blank;

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    const em = t.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    // This studio approves prepared items itself here (the proof flow has tests of its own).
    await em.nativeUpdate(Studio, { id: studio.id }, { proofsRequired: false });
    const filters = { [TENANT_FILTER]: { studioId: studio.id } };
    glass = await em.findOneOrFail(Blank, { name: 'Black-backed glass portrait' }, { populate: ['sizes'], filters });
    maple = await em.findOneOrFail(Blank, { name: 'Maple keepsake plaque' }, { populate: ['sizes'], filters });
    staff = request.agent(t.app);
    await signIn(staff, 'tobias@harbour-light.test', DEMO_PASSWORD);
  });

  /** A paid order of a 5 × 7 in glass portrait and a maple plaque, both photos approved and prepared. */
  async function approvedOrder(email: string) {
    const photo = await uploadBuyerPhoto(t, 'harbour-light', 1500, 2100);
    const orderId = await placePaidOrder(
      t,
      'harbour-light',
      [
        { blankId: glass.id, sizeId: glass.sizes.getItems().find((s) => s.label === '5 × 7 in')!.id, photo },
        { blankId: maple.id, sizeId: maple.sizes[0]!.id, photo },
      ],
      { email, name: 'Ada Penrose' },
    );
    const order = (await staff.get(`${work}/orders/${orderId}`).expect(200)).body as { items: Array<{ id: string; blankName: string }> };
    for (const item of order.items) {
      await staff.post(`${work}/items/${item.id}/approve-photo`).expect(200);
      await staff.post(`${work}/items/${item.id}/approve-without-proof`).expect(200, { stage: 'approved' });
    }
    const byName = (name: string) => order.items.find((i) => i.blankName === name)!.id;
    return { orderId, glassItem: byName(glass.name), mapleItem: byName(maple.name) };
  }

  async function renderedBatch(batchId: string): Promise<BatchView> {
    for (let i = 0; i < 600; i++) {
      const batch = (await staff.get(`${work}/production/batches/${batchId}`).expect(200)).body as BatchView;
      if (batch.items.every((item) => item.render.status === 'done' || item.render.status === 'failed')) return batch;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error('the render did not finish within a minute');
  }

  const download = async (renderId: string, kind: string) => {
    const link = (await staff.get(`${work}/production/renders/${renderId}/files/${kind}`).expect(200)).body as {
      url: string;
      expiresInSeconds: number;
      fileName: string;
    };
    const response = await fetch(link.url);
    expect(response.status).toBe(200);
    return { link, response, bytes: new Uint8Array(await response.arrayBuffer()) };
  };

  it('groups approved items by material and recipe, and refuses a batch that mixes them', async () => {
    const { glassItem, mapleItem } = await approvedOrder('ada@buyers.test');
    const board = (await staff.get(`${work}/production`).expect(200)).body as ProductionBoard;
    const glassGroup = board.groups.find((g) => g.items.some((i) => i.itemId === glassItem))!;
    expect(glassGroup).toMatchObject({
      materialName: 'Black-backed (painted) glass',
      machineName: 'Workshop CO2, 100 W',
      recipe: '360 lines per inch, Jarvis–Judice–Ninke, negative',
    });
    expect(board.groups.find((g) => g.items.some((i) => i.itemId === mapleItem))).toMatchObject({
      materialName: 'Maple',
      machineName: null,
    });
    const mixed = await staff
      .post(`${work}/production/batches`)
      .send({ itemIds: [glassItem, mapleItem] })
      .expect(400);
    expect(mixed.body.message).toMatch(/one material on one machine recipe/);
    await staff.post(`${work}/production/batches`).send({ itemIds: [] }).expect(400);
    // Marking an item burned before it is in production is an illegal move.
    const early = await staff.post(`${work}/items/${glassItem}/burned`).expect(409);
    expect(early.body.message).toMatch(/is approved and cannot become burned\. It can become: in production, prep, cancelled\./);
  });

  it('renders the engrave file, grayscale master and job sheet; burned and handed over, the order is fulfilled', async () => {
    const { orderId, glassItem, mapleItem } = await approvedOrder('bea@buyers.test');
    const created = await staff
      .post(`${work}/production/batches`)
      .send({ itemIds: [glassItem] })
      .expect(201);
    const batch = await renderedBatch(created.body.id);
    const [entry] = batch.items;
    expect(entry!.stage).toBe('in_production');
    expect(entry!.render).toMatchObject({ status: 'done', progress: 100, attempts: 1, stalled: false });
    expect(entry!.render.files.map((f) => f.kind)).toEqual(['engrave', 'master', 'sheet']);

    // The engrave file, read by Pillow (an independent PNG reader): mode '1' is bit depth 1, and
    // its dpi comes from pHYs. 5 × 7 in has a 4.5 × 6.5 in area; at the recipe's 360 lines per
    // inch that is 1620 × 2340 pixels (PNG spec §11.3.5.3: pixels per metre = round(360 / 0.0254)
    // = 14173, which Pillow reads back as 359.99 dpi).
    const engrave = await download(entry!.render.id, 'engrave');
    expect(engrave.link.expiresInSeconds).toBe(60);
    expect(new URL(engrave.link.url).searchParams.get('X-Amz-Expires')).toBe('60');
    expect(engrave.response.headers.get('content-disposition')).toMatch(/^attachment; filename="order-\d+-[0-9a-f]{8}-engrave\.png"$/);
    const engraveInfo = pillowImageInfo(engrave.bytes);
    expect(engraveInfo).toMatchObject({ format: 'PNG', mode: '1', width: 1620, height: 2340 });
    expect(engraveInfo.dpi![0]).toBeCloseTo(360, 1);
    // The grayscale master at the studio's default, 1000 pixels per inch: 4500 × 6500, pHYs
    // 39370 px/m (PNG specification), whatever the recipe's line density.
    const master = pillowImageInfo((await download(entry!.render.id, 'master')).bytes);
    expect(master).toMatchObject({ format: 'PNG', mode: 'LA', width: 4500, height: 6500 });
    expect(master.dpi![0]).toBeCloseTo(1000, 1);
    expect(entry!.render.files.find((f) => f.kind === 'master')).toMatchObject({ width: 4500, height: 6500 });

    // The job sheet, read back by Poppler: one page with the settings, the burn estimate and the
    // cautions, and a QR code that opens the order.
    const sheet = (await download(entry!.render.id, 'sheet')).bytes;
    expect(pdfPages(sheet)).toBe(1);
    const text = pdfText(sheet).replace(/\s+/g, ' ');
    expect(text).toMatch(/Order \d+: item 1 of 2/);
    for (const words of [
      'Workshop CO2, 100 W',
      '5 in/s',
      '10–14.5 %',
      '360 lines per inch',
      'Negative',
      'Before you burn',
      'Class 4 laser product',
      'Never burn PVC or vinyl',
      'licensed practice',
    ])
      expect(text).toContain(words);
    // Burn time by hand: 6.5 in × 360 = 2340 rows (the engrave file's own height), each (114.3 + 2 × 5) mm at 5 in/s
    // (127 mm/s) plus a 0.05 s turnaround = 1.02874 s, so 2407 s (common practice, no source).
    expect(text).toContain('40 min 07 s per piece');
    expect(await pdfFirstPageQr(sheet)).toBe(`${t.env.APP_URL}/studio/harbour-light/orders/${orderId}`);
    // Each link to a file made from the buyer's photo is in the audit log, under who asked for it.
    const downloads = await t.orm.em
      .fork()
      .find(
        AuditEntry,
        { action: 'render.downloaded', details: { renderId: entry!.render.id } },
        { filters: false, orderBy: { createdAt: 'asc' } },
      );
    expect(downloads.map((d) => [d.actorName, d.summary])).toEqual(
      ['engrave file', 'grayscale master', 'job sheet'].map((file) => [
        'Tobias Renn',
        `Downloaded the ${file} for Black-backed glass portrait, 5 × 7 in.`,
      ]),
    );

    // The maple plaque has no recipe: it batches alone, and its sheet says to set the machine by
    // hand and why there is no estimate. The owner has chosen masters at the line density.
    const owner = request.agent(t.app);
    await signIn(owner, 'maren@harbour-light.test', DEMO_PASSWORD);
    await owner
      .put(`${work}/settings/orders`)
      .send({
        lowResolutionPolicy: 'confirm',
        pickupEnabled: true,
        pickupNote: 'At the workshop.',
        proofsRequired: false,
        masterResolution: 'recipe',
      })
      .expect(200);
    const mapleBatch = await renderedBatch(
      (
        await staff
          .post(`${work}/production/batches`)
          .send({ itemIds: [mapleItem] })
          .expect(201)
      ).body.id,
    );
    expect(mapleBatch.machineName).toBeNull();
    const mapleText = pdfText((await download(mapleBatch.items[0]!.render.id, 'sheet')).bytes).replace(/\s+/g, ' ');
    expect(mapleText).toContain('None for this material');
    expect(mapleText).toContain('Not estimated: the material has no recipe for this machine.');
    const mapleFiles = mapleBatch.items[0]!.render.files;
    const [mapleEngrave, mapleMaster] = ['engrave', 'master'].map((kind) => mapleFiles.find((f) => f.kind === kind)!);
    expect([mapleMaster!.width, mapleMaster!.height]).toEqual([mapleEngrave!.width, mapleEngrave!.height]);
    expect(pillowImageInfo((await download(mapleBatch.items[0]!.render.id, 'master')).bytes).dpi![0]).toBeCloseTo(
      pillowImageInfo((await download(mapleBatch.items[0]!.render.id, 'engrave')).bytes).dpi![0],
      3,
    );

    await staff.post(`${work}/items/${glassItem}/burned`).expect(200, { stage: 'burned' });
    const notYet = await staff
      .post(`${work}/orders/${orderId}/handover`)
      .send({ method: 'pickup', itemIds: [mapleItem] })
      .expect(409);
    expect(notYet.body.message).toMatch(/is in production and cannot become picked up\. It can become: burned, approved\./);
    await staff
      .post(`${work}/orders/${orderId}/handover`)
      .send({ method: 'ship', itemIds: [glassItem], carrier: '', trackingNumber: '' })
      .expect(400);
    await staff
      .post(`${work}/orders/${orderId}/handover`)
      .send({ method: 'ship', itemIds: [glassItem], carrier: 'Parcelway', trackingNumber: 'PW 4471 0923' })
      .expect(200, { status: 'paid' });
    await staff.post(`${work}/items/${mapleItem}/burned`).expect(200);
    await staff
      .post(`${work}/orders/${orderId}/handover`)
      .send({ method: 'pickup', itemIds: [mapleItem] })
      .expect(200, { status: 'fulfilled' });

    const order = (await staff.get(`${work}/orders/${orderId}`).expect(200)).body;
    expect(order.items.find((i: { id: string }) => i.id === glassItem).handover).toMatchObject({
      method: 'ship',
      carrier: 'Parcelway',
      trackingNumber: 'PW 4471 0923',
      by: 'Tobias Renn',
    });
    expect(order.events.map((e: { text: string }) => e.text)).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^Engrave file, grayscale master and job sheet made for batch \d+\.$/),
        'Shipped with Parcelway, tracking PW 4471 0923, by Tobias Renn.',
        'Every item has left the studio: the order is complete.',
      ]),
    );
    const mails = await t.orm.em.fork().find(OutboxEmail, { to: 'bea@buyers.test' }, { orderBy: { createdAt: 'asc' } });
    expect(mails.map((m) => m.subject)).toEqual(
      expect.arrayContaining([expect.stringMatching(/^Order \d+ has shipped$/), expect.stringMatching(/^Order \d+: picked up$/)]),
    );
    expect(mails.find((m) => m.subject.endsWith('has shipped'))!.text).toContain('Tracking number: PW 4471 0923');
  }, 90_000); // Two full renders, the 80-megapixel master among them, beside the rest of the suite.

  it('burns a round slate coaster inside its circle: nothing fires outside it in the engrave file, and the master is clear there', async () => {
    const em = t.orm.em.fork();
    const fernhill = await em.findOneOrFail(Studio, { slug: 'fernhill-stone' });
    await em.nativeUpdate(Studio, { id: fernhill.id }, { proofsRequired: false, pickupEnabled: true, pickupNote: 'At the stone room.' });
    const coaster = await em.findOneOrFail(
      Blank,
      { name: 'Slate coaster' },
      { populate: ['sizes'], filters: { [TENANT_FILTER]: { studioId: fernhill.id } } },
    );
    const photo = await uploadBuyerPhoto(
      t,
      'fernhill-stone',
      1200,
      1200,
      await sharp({ create: { width: 1200, height: 1200, channels: 3, background: '#9aa3ab' } })
        .jpeg()
        .toBuffer(),
    );
    const orderId = await placePaidOrder(t, 'fernhill-stone', [{ blankId: coaster.id, sizeId: coaster.sizes[0]!.id, photo }], {
      email: 'rory@buyers.test',
      name: 'Rory Vance',
    });
    const dev = request.agent(t.app);
    await signIn(dev, 'dev@fernhill-stone.test', DEMO_PASSWORD);
    const fern = '/api/studios/fernhill-stone';
    const order = (await dev.get(`${fern}/orders/${orderId}`).expect(200)).body as { items: Array<{ id: string }> };
    const itemId = order.items[0]!.id;
    await dev.post(`${fern}/items/${itemId}/approve-photo`).expect(200);
    await dev.post(`${fern}/items/${itemId}/approve-without-proof`).expect(200);
    const created = (
      await dev
        .post(`${fern}/production/batches`)
        .send({ itemIds: [itemId] })
        .expect(201)
    ).body as { id: string };
    let batch: BatchView | undefined;
    for (let i = 0; i < 600 && !batch; i++) {
      const seen = (await dev.get(`${fern}/production/batches/${created.id}`).expect(200)).body as BatchView;
      if (seen.items.every((item) => item.render.status === 'done')) batch = seen;
      else await new Promise((r) => setTimeout(r, 100));
    }
    const renderId = batch!.items[0]!.render.id;
    const fetchFile = async (kind: string) => {
      const link = (await dev.get(`${fern}/production/renders/${renderId}/files/${kind}`).expect(200)).body as { url: string };
      return Buffer.from(await (await fetch(link.url)).arrayBuffer());
    };
    // Read by Pillow (an independent PNG reader).
    const engrave = pillowOpen(await fetchFile('engrave'));
    const [w, h] = engrave.size;
    const bits = unpackBits(engrave.bytes, w, h);
    // Inside the circle inscribed in the 70 × 70 mm area, on pixel centres (geometry):
    // (x + ½ − w/2)² + (y + ½ − h/2)² ≤ (min(w, h)/2)².
    const inCircle = (x: number, y: number) => (x + 0.5 - w / 2) ** 2 + (y + 0.5 - h / 2) ** 2 <= (Math.min(w, h) / 2) ** 2;
    let firedOutside = 0;
    let firedInside = 0;
    for (let y = 0; y < h; y++)
      for (let x = 0; x < w; x++)
        if (bits[y * w + x] === 0) {
          if (inCircle(x, y)) firedInside++;
          else firedOutside++;
        }
    expect(firedOutside).toBe(0);
    expect(firedInside).toBeGreaterThan(0.05 * Math.PI * (w / 2) ** 2);
    const master = pillowOpen(await fetchFile('master'));
    expect(master.mode).toBe('LA');
    const [mw, mh] = master.size;
    expect(mw).toBe(Math.round((70 / 25.4) * 1000));
    let opaqueOutside = 0;
    for (let y = 0; y < mh; y++)
      for (let x = 0; x < mw; x++)
        if ((x + 0.5 - mw / 2) ** 2 + (y + 0.5 - mh / 2) ** 2 > (mw / 2) ** 2 && master.bytes[(y * mw + x) * 2 + 1]! > 0) opaqueOutside++;
    expect(opaqueOutside).toBe(0);

    // A pickup order, its only piece engraved: the buyer is told it is ready, and where.
    await dev.post(`${fern}/items/${itemId}/burned`).expect(200, { stage: 'burned' });
    const ready = await t.orm.em.fork().findOneOrFail(OutboxEmail, { to: 'rory@buyers.test', subject: { $like: '%ready to collect' } });
    expect(ready.text).toContain('Where and when: At the stone room.');
    expect(ready.fromName).toBe('Fernhill Stoneworks');
  });

  it('says why a burn is not estimated, in the workspace’s own words for the speed unit', () => {
    const machine = {
      name: 'Fibre 30 W',
      laserKind: 'fibre',
      speed: 40,
      speedUnit: 'percent' as const,
      powerMinPercent: 20,
      powerMaxPercent: 30,
      passes: 1,
      notes: '',
    };
    expect(burnEstimateLine(null, null, 1)).toBe('Not estimated: the material has no recipe for this machine.');
    expect(burnEstimateLine(null, machine, 1)).toBe(
      `Not estimated: the recipe’s speed is a share of the machine’s top speed (${SPEED_UNIT_LABELS.percent}), not a length per second.`,
    );
    expect(burnEstimateLine(125, machine, 2)).toBe('2 min 05 s per piece, 4 min 10 s for 2 (raster, 5 mm overscan)');
  });

  it('takes an item out of its batch: the render and its files go, and it waits for a new batch', async () => {
    const { glassItem } = await approvedOrder('cal@buyers.test');
    const batch = await renderedBatch(
      (
        await staff
          .post(`${work}/production/batches`)
          .send({ itemIds: [glassItem] })
          .expect(201)
      ).body.id,
    );
    const renderId = batch.items[0]!.render.id;
    await staff.post(`${work}/items/${glassItem}/out-of-batch`).expect(200, { stage: 'approved' });
    await staff.get(`${work}/production/renders/${renderId}/files/engrave`).expect(404);
    const prefixes = await t.storage.list(`studios/`);
    expect(prefixes.filter((key) => key.includes('/renders/') && key.includes(renderId))).toEqual([]);
    const board = (await staff.get(`${work}/production`).expect(200)).body as ProductionBoard;
    expect(board.groups.flatMap((g) => g.items.map((i) => i.itemId))).toContain(glassItem);
    // Only a failed render can be retried.
    const again = await staff
      .post(`${work}/production/batches`)
      .send({ itemIds: [glassItem] })
      .expect(201);
    const done = await renderedBatch(again.body.id);
    const retry = await staff.post(`${work}/production/renders/${done.items[0]!.render.id}/retry`).expect(409);
    expect(retry.body.message).toBe('This render is done already.');
  });
});
