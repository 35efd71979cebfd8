import { orientedArea } from '#shared/imaging/sizing.ts';
import type { PrepSettings } from '#shared/schemas/prep.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { burnPiece, type Burned, type Piece } from '#server/imaging/piece.ts';
import type { OrderItem } from '../orders/order.entity.ts';

/**
 * An order item as a piece to burn (`server/imaging/piece.ts`): its placement, its area turned
 * as the buyer chose, its blank's shape and its inscription. Every caller (the render job, the
 * proof, the 1:1 region) goes through here, so they all burn the same piece.
 */
export const pieceOf = (item: OrderItem): Piece => ({
  placement: item.placement,
  area: orientedArea(item.snapshot.size, item.orientation),
  shape: item.snapshot.blank.shape,
  inscription: item.inscription,
});

export async function originalPhoto(storage: Storage, item: OrderItem): Promise<Buffer> {
  return Buffer.from((await storage.get(item.photo.originalKey)).body);
}

/** The item burned with `prep` at its line density, from the original photo. */
export async function burnItem(storage: Storage, item: OrderItem, prep: PrepSettings): Promise<Burned> {
  return burnPiece(await originalPhoto(storage, item), pieceOf(item), prep);
}
