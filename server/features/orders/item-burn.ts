import type { Bitmap, Rgba8 } from '../../../shared/imaging/image.ts';
import { renderBitmap, type PrepSettings as PipelineSettings } from '../../../shared/imaging/pipeline.ts';
import { orientedArea } from '../../../shared/imaging/sizing.ts';
import { pipelineSettings } from '../../../shared/orders/prep-pipeline.ts';
import type { PrepSettings } from '../../../shared/schemas/prep.ts';
import type { Storage } from '../../adapters/storage.ts';
import { burnInscription, inscriptionCoverage } from '../../imaging/inscription.ts';
import { placePhoto } from '../../imaging/placement.ts';
import type { OrderItem } from './order.entity.ts';

/**
 * An item as it burns, in two steps every caller shares (the render job, the proof, the 1:1
 * region): the original photo placed in the item's engraving area at a line density, then
 * prepared, halftoned and lettered with the inscription.
 */
export async function placeItemPhoto(storage: Storage, item: OrderItem, linesPerInch: number): Promise<Rgba8> {
  const original = await storage.get(item.photo.originalKey);
  return placePhoto(Buffer.from(original.body), item.placement, orientedArea(item.snapshot.size, item.orientation), linesPerInch);
}

export async function burnItem(item: OrderItem, placed: Rgba8, prep: PrepSettings): Promise<{ settings: PipelineSettings; lettering: Uint8Array | null; bitmap: Bitmap }> {
  const settings = pipelineSettings(prep, placed);
  const lettering = await inscriptionCoverage(item.inscription, placed.width, placed.height);
  return { settings, lettering, bitmap: burnInscription(renderBitmap(placed, settings), lettering) };
}
