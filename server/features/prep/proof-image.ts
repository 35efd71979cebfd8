import sharp from 'sharp';
import { renderMockup } from '#shared/imaging/mockup.ts';
import { prepAtWidth } from '#shared/orders/prep-pipeline.ts';
import type { PrepSettings } from '#shared/schemas/prep.ts';
import type { Storage } from '#server/adapters/storage.ts';
import type { OrderItem } from '../orders/order.entity.ts';
import { burnItem, pieceOf } from './burn.service.ts';

/** The proof's width in pixels: a screen's worth, far coarser than the burn. */
export const PROOF_WIDTH = 900;

/**
 * The proof the buyer approves: the item burned from the original photo with the current prep
 * at the proof's size (`prepAtWidth`, as the mock-up and the staff preview shrink it), drawn in
 * the material's colours inside the blank's shape. It looks as the burn will, only larger-grained.
 */
export async function renderProofImage(storage: Storage, item: OrderItem, prep: PrepSettings): Promise<Buffer> {
  const { bitmap } = await burnItem(storage, item, prepAtWidth(prep, pieceOf(item).area.widthMm, PROOF_WIDTH));
  const { blank } = item.snapshot;
  const mock = renderMockup({
    bitmap,
    shape: blank.shape,
    surfaceColour: blank.material.surfaceColour,
    markColour: blank.material.markColour,
  });
  return sharp(Buffer.from(mock.data.buffer, mock.data.byteOffset, mock.data.length), {
    raw: { width: mock.width, height: mock.height, channels: 4 },
  })
    .png({ compressionLevel: 8 })
    .toBuffer();
}
