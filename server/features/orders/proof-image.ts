import sharp from 'sharp';
import { renderMockup } from '../../../shared/imaging/mockup.ts';
import { orientedArea } from '../../../shared/imaging/sizing.ts';
import type { PrepSettings } from '../../../shared/schemas/prep.ts';
import type { Storage } from '../../adapters/storage.ts';
import type { OrderItem } from './order.entity.ts';
import { burnItem, placeItemPhoto } from './item-burn.ts';

/** The proof's width in pixels: a screen's worth, far coarser than the burn. */
export const PROOF_WIDTH = 900;

/**
 * The proof the buyer approves: the item's photo placed and prepared with the current prep
 * settings, halftoned and drawn in the material's colours inside the blank's shape, on the
 * server from the original photo. Sharpening and feather are scaled from the burn's
 * resolution to the proof's, so it looks as the burn will, only larger-grained.
 */
export async function renderProofImage(storage: Storage, item: OrderItem, prep: PrepSettings): Promise<Buffer> {
  const area = orientedArea(item.snapshot.size, item.orientation);
  const proofLinesPerInch = PROOF_WIDTH / (area.widthMm / 25.4);
  const scale = proofLinesPerInch / prep.linesPerInch;
  const placed = await placeItemPhoto(storage, item, proofLinesPerInch);
  const scaled = { ...prep, sharpenRadius: Math.max(0.5, prep.sharpenRadius * scale), featherRadius: prep.featherRadius * scale, linesPerInch: proofLinesPerInch };
  const { bitmap } = await burnItem(item, placed, scaled);
  const { blank } = item.snapshot;
  const mock = renderMockup({ bitmap, shape: blank.shape, surfaceColour: blank.material.surfaceColour, markColour: blank.material.markColour });
  return sharp(Buffer.from(mock.data.buffer, mock.data.byteOffset, mock.data.length), { raw: { width: mock.width, height: mock.height, channels: 4 } }).png({ compressionLevel: 8 }).toBuffer();
}
