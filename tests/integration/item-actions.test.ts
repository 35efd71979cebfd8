import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { Blank } from '#server/features/catalog/catalog.entity.ts';
import { Order, OrderItem } from '#server/features/orders/order.entity.ts';
import { ProductionBatch, Render } from '#server/features/production/production.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { ITEM_ACTIONS, ITEM_STAGES, type ItemAction, type ItemStage } from '#shared/orders/stages.ts';
import { signIn } from '../support/factories.ts';
import { placePaidOrder, uploadBuyerPhoto } from '../support/orders.ts';
import { useTestApp } from '../support/test-app.ts';

/**
 * Every staff action on an item, tried from every stage: it works exactly from the stages the
 * state machine gives it (and the item lands where the machine says), and answers 409 from all
 * the others. The buyer's own actions (a new photo, a proof's answer) are tried in review.test.ts.
 */
describe('item actions from every stage', () => {
  const t = useTestApp();
  const work = '/api/studios/harbour-light';
  let staff: ReturnType<typeof request.agent>;
  let studio: Studio;
  let orderId: string;
  let itemId: string;

  const fork = () => {
    const em = t.orm.em.fork();
    em.setFilterParams(TENANT_FILTER, { studioId: studio.id });
    return em;
  };

  beforeAll(async () => {
    await seedDemo(t.orm.em.fork());
    studio = await t.orm.em.fork().findOneOrFail(Studio, { slug: 'harbour-light' });
    await t.orm.em.fork().nativeUpdate(Studio, { id: studio.id }, { proofsRequired: false });
    const glass = await fork().findOneOrFail(Blank, { name: 'Black-backed glass portrait' }, { populate: ['sizes'] });
    const photo = await uploadBuyerPhoto(t, 'harbour-light', 900, 1260);
    orderId = await placePaidOrder(t, 'harbour-light', [{ blankId: glass.id, sizeId: glass.sizes[0]!.id, photo }], {
      email: 'moss@buyers.test',
      name: 'Moss Avery',
    });
    itemId = (await fork().findOneOrFail(OrderItem, { order: orderId })).id;
    staff = request.agent(t.app);
    await signIn(staff, 'tobias@harbour-light.test', DEMO_PASSWORD);
  });

  /** Puts the item in a stage as if it had got there, with what that stage implies. */
  async function putIn(stage: ItemStage) {
    const em = fork();
    await em.nativeDelete(Render, { item: itemId });
    await em.nativeUpdate(OrderItem, { id: itemId }, { stage });
    await em.nativeUpdate(Order, { id: orderId }, { status: 'paid' });
    if (stage === 'in_production') {
      const batch = em.create(ProductionBatch, {
        studio: studio.id,
        number: Math.floor(Math.random() * 1e9),
        materialName: 'Glass',
        recipeId: null,
        machine: null,
        createdBy: 'Test',
      });
      const file = { key: 'none', bytes: 1, contentType: 'image/png' };
      em.create(Render, {
        studio: studio.id,
        item: itemId,
        batch,
        status: 'done',
        keyPrefix: `studios/${studio.id}/renders/test`,
        prepVersion: 0,
        files: { engrave: file, master: file, sheet: file },
      });
      await em.flush();
    }
  }

  const calls: Record<Exclude<ItemAction, 'receiveNewPhoto' | 'approveProof' | 'requestChanges'>, () => request.Test> = {
    approvePhoto: () => staff.post(`${work}/items/${itemId}/approve-photo`),
    askNewPhoto: () => staff.post(`${work}/items/${itemId}/ask-new-photo`).send({ reason: 'blurry' }),
    sendProof: () => staff.post(`${work}/items/${itemId}/send-proof`),
    approveWithoutProof: () => staff.post(`${work}/items/${itemId}/approve-without-proof`),
    reopenPrep: () => staff.post(`${work}/items/${itemId}/reopen-prep`),
    startProduction: () => staff.post(`${work}/production/batches`).send({ itemIds: [itemId] }),
    takeOutOfBatch: () => staff.post(`${work}/items/${itemId}/out-of-batch`),
    markBurned: () => staff.post(`${work}/items/${itemId}/burned`),
    ship: () =>
      staff
        .post(`${work}/orders/${orderId}/handover`)
        .send({ method: 'ship', itemIds: [itemId], carrier: 'Parcelway', trackingNumber: 'PW 1000 2000' }),
    handOverAtPickup: () => staff.post(`${work}/orders/${orderId}/handover`).send({ method: 'pickup', itemIds: [itemId] }),
  };
  const stages = ITEM_STAGES.filter((s) => s !== 'unpaid');

  for (const [action, call] of Object.entries(calls) as Array<[keyof typeof calls, () => request.Test]>) {
    it(`${action}: works from ${ITEM_ACTIONS[action].from.join(', ')} only`, async () => {
      for (const stage of stages) {
        await putIn(stage);
        const res = await call();
        const allowed = (ITEM_ACTIONS[action].from as readonly string[]).includes(stage);
        expect(res.status, `${action} from ${stage}: ${JSON.stringify(res.body)}`).toBe(
          allowed ? (action === 'startProduction' ? 201 : 200) : 409,
        );
        const now = (await fork().findOneOrFail(OrderItem, { id: itemId })).stage;
        expect(now, `${action} from ${stage}`).toBe(allowed ? ITEM_ACTIONS[action].to : stage);
      }
    });
  }
});
