import { randomUUID } from 'node:crypto';
import { AppError } from '#shared/errors.ts';
import type { ImageUploadRequest, UploadTicket } from '#shared/schemas/uploads.ts';
import type { Storage } from '#server/adapters/storage.ts';

/**
 * Presigned uploads. Keys are made here under a prefix that names the studio and purpose, so a
 * claim can check a key belongs to the caller before the app reads a byte of it.
 */
export async function issueUpload(storage: Storage, prefix: string, request: ImageUploadRequest): Promise<UploadTicket> {
  const key = `${prefix}/${randomUUID()}`;
  const url = await storage.presignUpload(key, { contentType: request.contentType, contentLength: request.contentLength });
  return { key, url, headers: { 'content-type': request.contentType } };
}

/** The bytes of an upload made with a ticket under `prefix`; the object is left for the caller. */
export async function readUpload(storage: Storage, prefix: string, key: string, maxBytes: number): Promise<Buffer> {
  const inPrefix = key.startsWith(`${prefix}/`) && /^[\w/-]+$/.test(key) && !key.includes('..');
  const head = inPrefix ? await storage.head(key) : undefined;
  if (!head)
    throw new AppError('NOT_FOUND', 'That upload has not arrived. Please upload the file again.', {
      issues: [{ path: ['key'], message: 'No such upload.' }],
    });
  if (head.size > maxBytes) throw new AppError('PAYLOAD_TOO_LARGE', `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB.`);
  return Buffer.from((await storage.get(key)).body);
}
