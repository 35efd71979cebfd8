import sharp from 'sharp';
import request from 'supertest';
import type { TestApp } from './test-app.ts';
import { payWithTestCard, postSignedEvent } from './payments.ts';

/**
 * Buyers' side for workspace tests: a photo uploaded as the storefront does (presigned PUT, then
 * accepted), and a paid order placed through checkout and the payment webhook.
 */
export async function uploadBuyerPhoto(t: TestApp, studioSlug: string, width: number, height: number, bytes?: Buffer) {
  const store = `/api/storefront/${studioSlug}`;
  const body = bytes ?? (await sharp({ create: { width, height, channels: 3, background: '#5a6b7c' } }).jpeg().toBuffer());
  const ticket = (await request(t.app).post(`${store}/photo-uploads`).send({ contentType: 'image/jpeg', contentLength: body.length }).expect(201)).body;
  await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: new Uint8Array(body) });
  return (await request(t.app).post(`${store}/buyer-photos`).send({ key: ticket.key }).expect(201)).body as { id: string; width: number; height: number };
}

export type OrderLine = { blankId: string; sizeId: string; orientation?: 'portrait' | 'landscape'; photo: { id: string; width: number; height: number } };

export async function placePaidOrder(t: TestApp, studioSlug: string, lines: OrderLine[], buyer: { email: string; name: string }, delivery: object = { method: 'pickup' }): Promise<string> {
  const placed = await request(t.app)
    .post(`/api/storefront/${studioSlug}/orders`)
    .send({
      items: lines.map((line) => ({ blankId: line.blankId, sizeId: line.sizeId, orientation: line.orientation ?? 'portrait', quantity: 1, photoId: line.photo.id, placement: { crop: { left: 0, top: 0, width: line.photo.width, height: line.photo.height } }, rightsConfirmed: true })),
      buyer,
      delivery,
    })
    .expect(201);
  const sessionId = new URL(placed.body.paymentUrl).pathname.split('/').pop()!;
  // Paid on the stand-in's pay page; its event reaches the app as the provider's webhook would.
  await payWithTestCard(placed.body.paymentUrl);
  const session = await t.payments.stripe.checkout.sessions.retrieve(sessionId);
  await postSignedEvent(t, { id: `evt_${sessionId}`, object: 'event', type: 'checkout.session.completed', data: { object: session } }).expect(200);
  return placed.body.orderId as string;
}
