import type { EntityManager } from '@mikro-orm/postgresql';
import { assetPaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import type { BuyerPhotoView } from '#shared/schemas/photos.ts';
import { MAX_IMAGE_UPLOAD_BYTES, type ImageUploadRequest, type UploadTicket } from '#shared/schemas/uploads.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { makePhotoDerivatives, type PhotoDerivatives } from '#server/imaging/photo-derivatives.ts';
import { isUuid } from '#server/lib/tokens.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { issueUpload, readUpload } from '../uploads/uploads.service.ts';
import { BuyerPhoto } from './buyer-photo.entity.ts';

const uploadPrefix = (studio: Studio) => `uploads/${studio.id}/buyer-photos`;

export function startBuyerPhotoUpload(storage: Storage, studio: Studio, request: ImageUploadRequest): Promise<UploadTicket> {
  return issueUpload(storage, uploadPrefix(studio), request);
}

/**
 * Takes a buyer's upload: every check runs before anything is written, so a refused file leaves
 * no row and no stored copy; the upload itself is removed either way once read.
 */
export async function acceptBuyerPhoto(em: EntityManager, storage: Storage, studio: Studio, key: string): Promise<BuyerPhoto> {
  const bytes = await readUpload(storage, uploadPrefix(studio), key, MAX_IMAGE_UPLOAD_BYTES);
  let made;
  try {
    made = await makePhotoDerivatives(bytes);
  } catch (error) {
    // Not a photo we can use: the upload goes, and the buyer hears why.
    await storage.remove(key).catch(() => undefined);
    throw error;
  }
  const photo = await storeBuyerPhoto(em, storage, studio, bytes, made);
  // The upload has been copied into place; only now is it let go.
  await storage.remove(key).catch(() => undefined);
  return photo;
}

export async function findBuyerPhoto(em: EntityManager, studio: Studio, id: string): Promise<BuyerPhoto> {
  const photo = isUuid(id) ? await em.findOne(BuyerPhoto, { id, studio }) : null;
  if (!photo) throw new AppError('NOT_FOUND', 'There is no such photo. Please upload it again.');
  return photo;
}

export const buyerPhotoView = (studio: Studio, p: BuyerPhoto): BuyerPhotoView => ({
  id: p.id,
  width: p.width,
  height: p.height,
  previewUrl: assetPaths.buyerPhotoPreview(studio.slug, p.id),
  previewWidth: p.previewWidth,
  previewHeight: p.previewHeight,
  thumbUrl: assetPaths.buyerPhotoThumb(studio.slug, p.id),
  quality: p.quality,
});

/**
 * A photo's bytes and their derivatives stored under the studio, with its row (flushed). Nothing
 * is half-stored: on any failure the row and the copies go. Accepting an upload and the demo
 * history both store photos through this.
 */
export async function storeBuyerPhoto(
  em: EntityManager,
  storage: Storage,
  studio: Studio,
  bytes: Buffer,
  made: PhotoDerivatives,
): Promise<BuyerPhoto> {
  const photo = em.create(BuyerPhoto, {
    studio,
    originalKey: '',
    previewKey: '',
    thumbKey: '',
    format: made.facts.format,
    width: made.facts.width,
    height: made.facts.height,
    previewWidth: made.preview.width,
    previewHeight: made.preview.height,
    byteSize: bytes.length,
    quality: made.quality,
  });
  const base = `studios/${studio.id}/buyer-photos/${photo.id}`;
  Object.assign(photo, { originalKey: `${base}/original`, previewKey: `${base}/preview.webp`, thumbKey: `${base}/thumb.webp` });
  const stored = [photo.originalKey, photo.previewKey, photo.thumbKey];
  try {
    await Promise.all([
      storage.put(photo.originalKey, bytes, `image/${made.facts.format}`),
      storage.put(photo.previewKey, made.preview.data, 'image/webp'),
      storage.put(photo.thumbKey, made.thumb, 'image/webp'),
    ]);
    await em.flush();
  } catch (error) {
    // Nothing half-stored: no row, no stray copies; the upload stays for another try.
    em.remove(photo);
    await Promise.all(stored.map((k) => storage.remove(k).catch(() => undefined)));
    throw error;
  }
  return photo;
}
