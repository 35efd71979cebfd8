import sharp from 'sharp';
import request from 'supertest';
import type { TestApp } from './test-app.ts';
import { orientedArea } from '#shared/imaging/sizing.ts';
import { payWithTestCard, postSignedEvent } from './payments.ts';

/**
 * Buyers' side for workspace tests: a photo uploaded as the storefront does (presigned PUT, then
 * accepted), and a paid order placed through checkout and the payment webhook.
 */
export async function uploadBuyerPhoto(t: TestApp, studioSlug: string, width: number, height: number, bytes?: Buffer) {
  const store = `/api/storefront/${studioSlug}`;
  const body =
    bytes ??
    (await sharp({ create: { width, height, channels: 3, background: '#5a6b7c' } })
      .jpeg()
      .toBuffer());
  const ticket = (
    await request(t.app).post(`${store}/photo-uploads`).send({ contentType: 'image/jpeg', contentLength: body.length }).expect(201)
  ).body;
  await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(body) });
  return (await request(t.app).post(`${store}/buyer-photos`).send({ key: ticket.key }).expect(201)).body as {
    id: string;
    width: number;
    height: number;
  };
}

/**
 * The designer's starting framing: the largest window of the area's proportions inside the
 * photo, centred (checkout refuses a window of other proportions, which would burn stretched).
 */
export function fillCrop(photo: { width: number; height: number }, area: { widthMm: number; heightMm: number }) {
  const aspect = area.widthMm / area.heightMm;
  const width = Math.min(photo.width, photo.height * aspect);
  const height = width / aspect;
  return { left: (photo.width - width) / 2, top: (photo.height - height) / 2, width, height };
}

/** A size's engraving area turned as ordered, from the storefront's own listing. */
export async function orderedArea(
  t: TestApp,
  studioSlug: string,
  line: { blankId: string; sizeId: string; orientation?: 'portrait' | 'landscape' },
) {
  const listed = (await request(t.app).get(`/api/storefront/${studioSlug}/blanks`).expect(200)).body as {
    blanks: Array<{ id: string; sizes: Array<{ id: string; areaWidthMm: number; areaHeightMm: number }> }>;
  };
  const size = listed.blanks.find((b) => b.id === line.blankId)?.sizes.find((s) => s.id === line.sizeId);
  if (!size) throw new Error(`size ${line.sizeId} is not on sale`);
  return orientedArea(size, line.orientation ?? 'portrait');
}

export type OrderLine = {
  blankId: string;
  sizeId: string;
  orientation?: 'portrait' | 'landscape';
  photo: { id: string; width: number; height: number };
};

export async function placePaidOrder(
  t: TestApp,
  studioSlug: string,
  lines: OrderLine[],
  buyer: { email: string; name: string },
  delivery: object = { method: 'pickup' },
): Promise<string> {
  const areas = await Promise.all(lines.map((line) => orderedArea(t, studioSlug, line)));
  const placed = await request(t.app)
    .post(`/api/storefront/${studioSlug}/orders`)
    .send({
      items: lines.map((line, i) => ({
        blankId: line.blankId,
        sizeId: line.sizeId,
        orientation: line.orientation ?? 'portrait',
        quantity: 1,
        photoId: line.photo.id,
        placement: { crop: fillCrop(line.photo, areas[i]!) },
        rightsConfirmed: true,
      })),
      buyer,
      delivery,
    })
    .expect(201);
  const sessionId = new URL(placed.body.paymentUrl).pathname.split('/').pop()!;
  // Paid on the stand-in's pay page; its event reaches the app as the provider's webhook would.
  await payWithTestCard(placed.body.paymentUrl);
  const session = await t.payments.stripe.checkout.sessions.retrieve(sessionId);
  await postSignedEvent(t, {
    id: `evt_${sessionId}`,
    object: 'event',
    type: 'checkout.session.completed',
    data: { object: session },
  }).expect(200);
  return placed.body.orderId as string;
}
