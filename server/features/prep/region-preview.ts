import type { PrepSettings, RegionPreview } from '#shared/schemas/prep.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { encodeBitmapPng } from '#server/imaging/png-1bit.ts';
import type { OrderItem } from '../orders/order.entity.ts';
import { burnItem } from './burn.service.ts';

/** The side of the 1:1 region, in dots of the burn. */
export const REGION_SIDE = 480;

/**
 * A region of the item as it will burn, at the machine's resolution, with settings that need
 * not be saved yet: the whole output is made as the engrave file is (the sharpening and the
 * cut-out's feather need their neighbours), then the region around `centre` is cut from it.
 */
export async function regionPreview(
  storage: Storage,
  item: OrderItem,
  settings: PrepSettings,
  centre: { x: number; y: number },
): Promise<RegionPreview> {
  const { bitmap } = await burnItem(storage, item, settings);
  const width = Math.min(REGION_SIDE, bitmap.width);
  const height = Math.min(REGION_SIDE, bitmap.height);
  const left = Math.min(Math.max(0, Math.round(centre.x * bitmap.width - width / 2)), bitmap.width - width);
  const top = Math.min(Math.max(0, Math.round(centre.y * bitmap.height - height / 2)), bitmap.height - height);
  const data = new Uint8Array(width * height);
  for (let y = 0; y < height; y++)
    data.set(bitmap.data.subarray((top + y) * bitmap.width + left, (top + y) * bitmap.width + left + width), y * width);
  const png = encodeBitmapPng({ width, height, data }, settings.linesPerInch);
  return {
    image: `data:image/png;base64,${png.toString('base64')}`,
    region: { left, top, width, height },
    output: { width: bitmap.width, height: bitmap.height },
  };
}
