import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { seedDemo } from '#server/db/seed.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { Blank, BlankSize, Machine, Recipe } from '#server/features/catalog/catalog.entity.ts';
import { snapshotForOrder } from '#server/features/catalog/catalog.service.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { useTestApp } from '../support/test-app.ts';
import { agentFor, createMember } from '../support/factories.ts';

describe('catalog', () => {
  const t = useTestApp();
  let owner: ReturnType<typeof request.agent>;
  let materials: Array<{
    id: string;
    name: string;
    defaultTone: string;
    linesPerInchMin: number;
    linesPerInchMax: number;
    forbiddenOn: string[];
    forbiddenReason: string;
  }>;
  const base = '/api/studios/copper-kiln/catalog';

  beforeAll(async () => {
    // A studio opened through the API, so it starts with the library as a real one does.
    await request(t.app)
      .post('/api/accounts/studios')
      .send({
        studioName: 'Copper Kiln',
        slug: 'copper-kiln',
        ownerName: 'Ada Kiln',
        email: 'ada@copper-kiln.test',
        password: 'a long password here',
      })
      .expect(201);
    owner = request.agent(t.app);
    const csrf = await owner.get('/api/auth/csrf');
    await owner
      .post('/api/auth/callback/credentials')
      .type('form')
      .send({ csrfToken: csrf.body.csrfToken, email: 'ada@copper-kiln.test', password: 'a long password here' });
    materials = (await owner.get(`${base}/materials`).expect(200)).body.materials;
  });

  const named = (name: string) => materials.find((m) => m.name === name)!;

  it('starts every new studio with the materials library', () => {
    for (const name of [
      'Black-backed (painted) glass',
      'Clear glass',
      'Slate',
      'Black granite',
      'Black marble',
      'Maple',
      'Walnut',
      'Alder',
      'Bamboo',
      'Cork',
      'Genuine leather',
      'Black anodised aluminium',
      'Powder-coated stainless (tumblers)',
      'Cast acrylic',
      'Mirror acrylic',
    ]) {
      expect(named(name), name).toBeDefined();
    }
  });

  it('uses trade defaults for tone and line density (common practice, no single source)', () => {
    // Painted glass, slate, black granite and marble, dark anodised aluminium burn as negatives;
    // wood burns dark: positive. Glass 300–360 lines per inch, granite about 250–260.
    for (const name of ['Black-backed (painted) glass', 'Slate', 'Black granite', 'Black marble', 'Black anodised aluminium'])
      expect(named(name).defaultTone, name).toBe('negative');
    for (const name of ['Maple', 'Walnut', 'Alder', 'Bamboo']) expect(named(name).defaultTone, name).toBe('positive');
    expect(named('Black-backed (painted) glass')).toMatchObject({ linesPerInchMin: 300, linesPerInchMax: 360 });
    expect(named('Black granite')).toMatchObject({ linesPerInchMin: 250, linesPerInchMax: 260 });
  });

  it('marks materials that must never go on a CO2 laser, with the reason', () => {
    for (const name of ['PVC and vinyl', 'Faux leather', 'PTFE (Teflon)', 'ABS', 'Polycarbonate', 'Fibreglass', 'Carbon fibre']) {
      expect(named(name).forbiddenOn, name).toContain('co2');
      expect(named(name).forbiddenReason.length, name).toBeGreaterThan(10);
    }
    expect(named('PVC and vinyl').forbiddenReason).toMatch(/chlorine/);
  });

  it('refuses a recipe for a forbidden material on that laser kind, saying why', async () => {
    const machine = (
      await owner
        .post(`${base}/machines`)
        .send({ name: 'CO2 60 W', laserKind: 'co2', powerWatts: 60, bedWidthMm: 600, bedHeightMm: 400, speedUnit: 'mm/s' })
        .expect(201)
    ).body;
    const res = await owner
      .post(`${base}/recipes`)
      .send({
        materialId: named('PVC and vinyl').id,
        machineId: machine.id,
        linesPerInch: 254,
        halftoneMethod: 'floyd-steinberg',
        tone: 'positive',
        speed: 200,
        powerMinPercent: 10,
        powerMaxPercent: 20,
        passes: 1,
      })
      .expect(400);
    expect(res.body.issues[0].path).toEqual(['materialId']);
    expect(res.body.message).toMatch(/PVC and vinyl must never be engraved on a CO2 laser: .*chlorine/);
    // The same machine takes painted glass; a second recipe for the same pair is a conflict.
    const good = {
      materialId: named('Black-backed (painted) glass').id,
      machineId: machine.id,
      linesPerInch: 360,
      halftoneMethod: 'jarvis-judice-ninke',
      tone: 'negative',
      speed: 5,
      powerMinPercent: 10,
      powerMaxPercent: 14.5,
      passes: 1,
    };
    await owner.post(`${base}/recipes`).send(good).expect(201);
    expect((await owner.post(`${base}/recipes`).send(good).expect(409)).body.issues[0].path).toEqual(['machineId']);
  });

  // Validation matrix: each bad field answers 400 naming that field, nothing is written.
  const goodMachine = { name: 'M', laserKind: 'co2', powerWatts: 40, bedWidthMm: 500, bedHeightMm: 300, speedUnit: 'mm/s' };
  const goodSize = {
    label: '5 × 7 in',
    outerWidthMm: 127,
    outerHeightMm: 177.8,
    areaWidthMm: 114,
    areaHeightMm: 165,
    orientation: 'either',
    priceMinor: 4900,
    stock: 10,
  };
  it.each([
    ['machines', goodMachine, { laserKind: 'plasma' }, 'laserKind'],
    ['machines', goodMachine, { powerWatts: -5 }, 'powerWatts'],
    ['machines', goodMachine, { speedUnit: 'rpm' }, 'speedUnit'],
    ['machines', goodMachine, { name: '' }, 'name'],
    [
      'materials',
      {
        name: 'X',
        family: 'stone',
        surfaceColour: '#000000',
        markColour: '#ffffff',
        defaultTone: 'negative',
        linesPerInchMin: 250,
        linesPerInchMax: 300,
      },
      { surfaceColour: 'black' },
      'surfaceColour',
    ],
    [
      'materials',
      {
        name: 'X',
        family: 'stone',
        surfaceColour: '#000000',
        markColour: '#ffffff',
        defaultTone: 'negative',
        linesPerInchMin: 250,
        linesPerInchMax: 300,
      },
      { linesPerInchMax: 200 },
      'linesPerInchMax',
    ],
    [
      'materials',
      {
        name: 'X',
        family: 'stone',
        surfaceColour: '#000000',
        markColour: '#ffffff',
        defaultTone: 'negative',
        linesPerInchMin: 250,
        linesPerInchMax: 300,
      },
      { forbiddenOn: ['co2'] },
      'forbiddenReason',
    ],
  ])('%s: a bad field (%j + %j) answers 400 on %s', async (resource, good, change, field) => {
    await owner
      .post(`${base}/${resource}`)
      .send(good)
      .expect(201)
      .catch(() => undefined);
    const res = await owner
      .post(`${base}/${resource}`)
      .send({ ...good, name: `${(good as { name: string }).name}-${Math.random()}`, ...change })
      .expect(400);
    expect(res.body.issues.map((i: { path: string[] }) => i.path[0])).toEqual([field]);
  });

  it.each([
    [{ linesPerInch: 90 }, 'linesPerInch'],
    [{ linesPerInch: 1300 }, 'linesPerInch'],
    [{ powerMaxPercent: 5 }, 'powerMaxPercent'],
    [{ powerMinPercent: -1 }, 'powerMinPercent'],
    [{ halftoneMethod: 'sparkles' }, 'halftoneMethod'],
    [{ passes: 0 }, 'passes'],
  ])('recipes: %j answers 400 on %s', async (change, field) => {
    const machine = (await owner.post(`${base}/machines`).send(goodMachine).expect(201)).body;
    const res = await owner
      .post(`${base}/recipes`)
      .send({
        materialId: named('Slate').id,
        machineId: machine.id,
        linesPerInch: 300,
        halftoneMethod: 'stucki',
        tone: 'negative',
        speed: 100,
        powerMinPercent: 10,
        powerMaxPercent: 20,
        passes: 1,
        ...change,
      })
      .expect(400);
    expect(res.body.issues.map((i: { path: string[] }) => i.path[0])).toEqual([field]);
  });

  it.each([
    [{ areaWidthMm: 200 }, 'areaWidthMm'],
    [{ priceMinor: 49.5 }, 'priceMinor'],
    [{ priceMinor: -1 }, 'priceMinor'],
    [{ stock: -2 }, 'stock'],
    [{ orientation: 'sideways' }, 'orientation'],
  ])('sizes: %j answers 400 on %s', async (change, field) => {
    const blank = (
      await owner
        .post(`${base}/blanks`)
        .send({ name: 'Glass', materialId: named('Clear glass').id, shape: 'rectangle' })
        .expect(201)
    ).body;
    const res = await owner
      .post(`${base}/blanks/${blank.id}/sizes`)
      .send({ ...goodSize, ...change })
      .expect(400);
    expect(res.body.issues.map((i: { path: string[] }) => i.path[0])).toEqual([field]);
  });

  it('refuses an engraving area that reaches past a round or oval blank, offering the largest that fits, and flags sizes left behind', async () => {
    const round = (
      await owner
        .post(`${base}/blanks`)
        .send({ name: 'Round slate', materialId: named('Slate').id, shape: 'circle' })
        .expect(201)
    ).body;
    const coaster = { label: '100 mm round', outerWidthMm: 100, outerHeightMm: 100, orientation: 'either', priceMinor: 1200, stock: null };
    // A 90 × 90 mm square's corners lie 63.6 mm from the centre, past the 50 mm radius; the
    // largest square inside a 100 mm circle has a side of 100 / √2 = 70.71 mm (geometry).
    const refused = await owner
      .post(`${base}/blanks/${round.id}/sizes`)
      .send({ ...coaster, areaWidthMm: 90, areaHeightMm: 90 })
      .expect(400);
    expect(refused.body.issues[0]).toEqual({ path: ['areaWidthMm'], message: refused.body.message });
    expect(refused.body.message).toBe(
      'A 3.54 × 3.54 in engraving area reaches past the edge of this round blank. The largest area of these proportions that fits is 2.78 × 2.78 in.',
    );
    await owner
      .post(`${base}/blanks/${round.id}/sizes`)
      .send({ ...coaster, areaWidthMm: 70.7, areaHeightMm: 70.7 })
      .expect(201);
    // An oval 120 × 80 mm: a 100 × 60 mm area has its corner at (50/60)² + (30/40)² = 1.26 > 1.
    const oval = (
      await owner
        .post(`${base}/blanks`)
        .send({ name: 'Oval plaque', materialId: named('Slate').id, shape: 'oval' })
        .expect(201)
    ).body;
    await owner
      .post(`${base}/blanks/${oval.id}/sizes`)
      .send({ ...coaster, label: 'Oval', outerWidthMm: 120, outerHeightMm: 80, areaWidthMm: 100, areaHeightMm: 60 })
      .expect(400);
    // Scaled by 1/√1.26 the corner lands on the ellipse: 89.1 × 53.4 mm fits.
    await owner
      .post(`${base}/blanks/${oval.id}/sizes`)
      .send({ ...coaster, label: 'Oval', outerWidthMm: 120, outerHeightMm: 80, areaWidthMm: 89, areaHeightMm: 53.4 })
      .expect(201);
    // A size saved on a rectangle that then becomes round is flagged on the blank, not lost.
    const tile = (
      await owner
        .post(`${base}/blanks`)
        .send({ name: 'Square tile', materialId: named('Slate').id, shape: 'rectangle' })
        .expect(201)
    ).body;
    await owner
      .post(`${base}/blanks/${tile.id}/sizes`)
      .send({ ...coaster, areaWidthMm: 90, areaHeightMm: 90 })
      .expect(201);
    await owner
      .put(`${base}/blanks/${tile.id}`)
      .send({ name: 'Square tile', materialId: named('Slate').id, shape: 'circle' })
      .expect(200);
    const flagged = (await owner.get(`${base}/blanks/${tile.id}`).expect(200)).body.sizes[0];
    expect(flagged.fit).toEqual({ fits: false, largest: { widthMm: 70.7, heightMm: 70.7 } });
  });

  it('shows buyers only active blanks, with prices in the studio’s currency and a stock state', async () => {
    const active = (
      await owner
        .post(`${base}/blanks`)
        .send({ name: 'Granite heart', materialId: named('Black granite').id, shape: 'rounded-rectangle', status: 'active' })
        .expect(201)
    ).body;
    await owner
      .post(`${base}/blanks/${active.id}/sizes`)
      .send({ ...goodSize, priceMinor: 3500, stock: 2 })
      .expect(201);
    await owner
      .post(`${base}/blanks`)
      .send({ name: 'Hidden draft', materialId: named('Slate').id, shape: 'circle', status: 'draft' })
      .expect(201);
    // On sale but with no size yet: nothing to buy, so not listed.
    await owner
      .post(`${base}/blanks`)
      .send({ name: 'No sizes yet', materialId: named('Slate').id, shape: 'circle', status: 'active' })
      .expect(201);
    const listed = (await request(t.app).get('/api/storefront/copper-kiln/blanks').expect(200)).body;
    expect(listed.open).toBe(true);
    expect(listed.blanks.map((b: { name: string }) => b.name)).toEqual(['Granite heart']);
    expect(listed.blanks[0].sizes[0]).toMatchObject({ price: '$35.00', stock: 'few-left', areaWidthMm: 114 });
    expect(listed.blanks[0].material.notes).toMatch(/Stone dust/);
  });

  it('sells nothing while the studio is suspended', async () => {
    const em = t.orm.em.fork();
    await em.nativeUpdate(Studio, { slug: 'copper-kiln' }, { status: 'suspended' });
    expect((await request(t.app).get('/api/storefront/copper-kiln/blanks').expect(200)).body).toEqual({ open: false, blanks: [] });
    await em.nativeUpdate(Studio, { slug: 'copper-kiln' }, { status: 'active' });
  });

  it('keeps an order’s copy of blank, size and recipe when the catalog changes later', async () => {
    const em = t.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'copper-kiln' });
    em.setFilterParams(TENANT_FILTER, { studioId: studio.id });
    const blank = await em.findOneOrFail(Blank, { name: 'Granite heart' }, { populate: ['material', 'sizes'] });
    const size = blank.sizes.getItems()[0]!;
    const recipe = await em.findOneOrFail(Recipe, { material: { name: 'Black-backed (painted) glass' } });
    const snapshot = snapshotForOrder(blank, size, recipe);
    await owner
      .put(`${base}/sizes/${size.id}`)
      .send({ ...goodSize, label: 'Renamed', priceMinor: 9900, stock: 1 })
      .expect(200);
    await owner
      .put(`${base}/recipes/${recipe.id}`)
      .send({
        materialId: named('Black-backed (painted) glass').id,
        machineId: (recipe.machine as Machine).id,
        linesPerInch: 300,
        halftoneMethod: 'stucki',
        tone: 'negative',
        speed: 9,
        powerMinPercent: 20,
        powerMaxPercent: 30,
        passes: 2,
      })
      .expect(200);
    expect(snapshot.size).toMatchObject({ label: '5 × 7 in', priceMinor: 3500 });
    expect(snapshot.recipe).toMatchObject({ linesPerInch: 360, speed: 5, powerMaxPercent: 14.5 });
    const fresh = await t.orm.em
      .fork()
      .findOneOrFail(BlankSize, { id: size.id }, { filters: { [TENANT_FILTER]: { studioId: studio.id } } });
    expect(fresh.priceMinor).toBe(9900);
  });

  it('gives the demo studios an example recipe to start from (checked with a test burn on scrap): painted glass, 100 W CO2, speed 5, power 10–14.5 %', async () => {
    await seedDemo(t.orm.em.fork());
    const em = t.orm.em.fork();
    const studio = await em.findOneOrFail(Studio, { slug: 'harbour-light' });
    const recipe = await em.findOneOrFail(
      Recipe,
      { studio },
      { populate: ['material', 'machine'], filters: { [TENANT_FILTER]: { studioId: studio.id } } },
    );
    expect(recipe.material.name).toBe('Black-backed (painted) glass');
    expect(recipe.machine).toMatchObject({ laserKind: 'co2', powerWatts: 100 });
    expect(recipe).toMatchObject({
      linesPerInch: 360,
      halftoneMethod: 'jarvis-judice-ninke',
      tone: 'negative',
      speed: 5,
      powerMinPercent: 10,
      powerMaxPercent: 14.5,
    });
    expect(recipe.notes).toMatch(/^A starting point, not a setting to trust: check it with a test burn on a scrap/);
    const staff = await agentFor(t.app, (await createMember(t.orm.em.fork(), studio, 'staff')).user);
    expect((await staff.get('/api/studios/harbour-light/catalog/blanks').expect(200)).body.blanks.length).toBe(2);
  });

  describe('product photos', () => {
    const jpeg = (width: number, height: number) =>
      sharp({ create: { width, height, channels: 3, background: '#7b5e3f' } })
        .jpeg()
        .toBuffer();
    /** Uploads as the browser does: ask for a ticket, PUT the bytes to storage with its headers. */
    async function upload(blankId: string, bytes: Buffer, contentType = 'image/jpeg') {
      const ticket = (
        await owner.post(`${base}/blanks/${blankId}/photo-uploads`).send({ contentType, contentLength: bytes.length }).expect(201)
      ).body;
      const put = await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(bytes) });
      expect(put.status).toBe(200);
      return ticket.key as string;
    }

    it('takes an uploaded photo, stores a web copy and shows it once the blank is active', async () => {
      const blank = (
        await owner
          .post(`${base}/blanks`)
          .send({ name: 'Photo tile', materialId: named('Slate').id, shape: 'rectangle' })
          .expect(201)
      ).body;
      const key = await upload(blank.id, await jpeg(2400, 1800));
      const photo = (await owner.post(`${base}/blanks/${blank.id}/photos`).send({ key }).expect(201)).body;
      // Scaled to fit 1600 px on the long side, never enlarged; the original upload is gone.
      expect(photo).toMatchObject({ width: 1600, height: 1200 });
      expect(await t.storage.head(key)).toBeUndefined();
      const image = await owner.get(photo.url).expect(200).expect('content-type', 'image/webp');
      expect((await sharp(image.body).metadata()).format).toBe('webp');
      // A draft's photo is not public; once active, the storefront lists and serves it.
      await request(t.app).get(`/api/storefront/copper-kiln/photos/${photo.id}`).expect(404);
      await owner.post(`${base}/blanks/${blank.id}/sizes`).send(goodSize).expect(201);
      await owner
        .put(`${base}/blanks/${blank.id}`)
        .send({ name: 'Photo tile', materialId: named('Slate').id, shape: 'rectangle', status: 'active' })
        .expect(200);
      const listed = (await request(t.app).get('/api/storefront/copper-kiln/blanks').expect(200)).body.blanks.find(
        (b: { id: string }) => b.id === blank.id,
      );
      expect(listed.photos).toHaveLength(1);
      await request(t.app).get(listed.photos[0].url).expect(200).expect('content-type', 'image/webp');
      await owner.delete(`${base}/photos/${photo.id}`).expect(204);
      await request(t.app).get(listed.photos[0].url).expect(404);
    });

    it('refuses what is not a usable photo, with a message to act on', async () => {
      const blank = (
        await owner
          .post(`${base}/blanks`)
          .send({ name: 'Refusals', materialId: named('Slate').id, shape: 'oval' })
          .expect(201)
      ).body;
      expect(
        (
          await owner
            .post(`${base}/blanks/${blank.id}/photo-uploads`)
            .send({ contentType: 'application/pdf', contentLength: 10 })
            .expect(400)
        ).body.issues[0].path,
      ).toEqual(['contentType']);
      expect(
        (
          await owner
            .post(`${base}/blanks/${blank.id}/photo-uploads`)
            .send({ contentType: 'image/png', contentLength: 26 * 1024 * 1024 })
            .expect(400)
        ).body.issues[0].path,
      ).toEqual(['contentLength']);
      const text = await upload(blank.id, Buffer.from('this is not an image at all, only words'));
      expect((await owner.post(`${base}/blanks/${blank.id}/photos`).send({ key: text }).expect(415)).body.message).toMatch(
        /Please send a JPEG, PNG or WebP photo\.$/,
      );
      const tiny = await upload(blank.id, await jpeg(200, 150));
      expect((await owner.post(`${base}/blanks/${blank.id}/photos`).send({ key: tiny }).expect(400)).body.message).toMatch(
        /200 × 150 pixels/,
      );
      // A key outside this studio's uploads is never read.
      await owner.post(`${base}/blanks/${blank.id}/photos`).send({ key: 'uploads/another-studio/blank-photos/x' }).expect(404);
      expect((await owner.get(`${base}/blanks/${blank.id}`).expect(200)).body.photos).toEqual([]);
    });
  });

  it('deletes a material only when no blank uses it, naming the blanks that do', async () => {
    const res = await owner.delete(`${base}/materials/${named('Black granite').id}`).expect(409);
    expect(res.body.message).toMatch(/Granite heart/);
    const spare = (
      await owner
        .post(`${base}/materials`)
        .send({
          name: 'Spare cork',
          family: 'cork',
          surfaceColour: '#b08a5a',
          markColour: '#5a3d22',
          defaultTone: 'positive',
          linesPerInchMin: 200,
          linesPerInchMax: 250,
        })
        .expect(201)
    ).body;
    await owner.delete(`${base}/materials/${spare.id}`).expect(204);
    await owner.delete(`${base}/materials/${spare.id}`).expect(404);
  });

  it('deletes a machine with the recipes written for it', async () => {
    const machine = (await owner.post(`${base}/machines`).send(goodMachine).expect(201)).body;
    const recipe = (
      await owner
        .post(`${base}/recipes`)
        .send({
          materialId: named('Maple').id,
          machineId: machine.id,
          linesPerInch: 254,
          halftoneMethod: 'floyd-steinberg',
          tone: 'positive',
          speed: 300,
          powerMinPercent: 15,
          powerMaxPercent: 40,
          passes: 1,
        })
        .expect(201)
    ).body;
    await owner.delete(`${base}/machines/${machine.id}`).expect(204);
    const recipes = (await owner.get(`${base}/recipes`).expect(200)).body.recipes;
    expect(recipes.map((r: { id: string }) => r.id)).not.toContain(recipe.id);
  });
});
