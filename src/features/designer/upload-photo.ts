import { AppError } from '#shared/errors.ts';
import { buyerPhotoSchema, type BuyerPhotoView } from '#shared/schemas/photos.ts';
import { uploadTicketSchema } from '#shared/schemas/uploads.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const HEIC = /\.(heic|heif)$/i;
export const isHeic = (file: File) => file.type === 'image/heic' || file.type === 'image/heif' || HEIC.test(file.name);

/**
 * Phones send HEIC, which the server cannot read: the browser converts it to JPEG first. The
 * converter is large, so it is loaded only when such a file arrives.
 */
export async function toUploadable(file: File): Promise<File> {
  if (!isHeic(file)) return file;
  const { default: heic2any } = await import('heic2any');
  try {
    const converted = await heic2any({ blob: file, toType: 'image/jpeg', quality: 0.92 });
    const blob = Array.isArray(converted) ? converted[0]! : converted;
    return new File([blob], file.name.replace(HEIC, '.jpg'), { type: 'image/jpeg' });
  } catch (cause) {
    throw new AppError(
      'UNSUPPORTED_MEDIA_TYPE',
      'This HEIC photo could not be converted here. Choose “Most Compatible” (JPEG) in your phone’s camera settings and try again.',
      { cause },
    );
  }
}

/** PUTs the file to the presigned URL with progress events; rejects on abort or failure. */
function putWithProgress(
  url: string,
  headers: Record<string, string>,
  file: File,
  onProgress: (share: number) => void,
  signal: AbortSignal,
): Promise<void> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('PUT', url);
    for (const [name, value] of Object.entries(headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (event) => event.lengthComputable && onProgress(event.loaded / event.total);
    xhr.onload = () =>
      xhr.status >= 200 && xhr.status < 300
        ? resolve()
        : reject(new AppError('SERVICE_UNAVAILABLE', `The upload was refused (${xhr.status}). Please try again.`));
    xhr.onerror = () => reject(new AppError('SERVICE_UNAVAILABLE', 'The upload was interrupted. Check your connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled.', 'AbortError'));
    signal.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(file);
  });
}

/** Ticket, upload straight to storage, then the server's checks: answers the accepted photo. */
export async function uploadBuyerPhoto(
  studioSlug: string,
  file: File,
  onProgress: (share: number) => void,
  signal: AbortSignal,
): Promise<BuyerPhotoView> {
  const base = `/api/storefront/${encodeURIComponent(studioSlug)}`;
  const ticket = await apiFetch(`${base}/photo-uploads`, {
    method: 'POST',
    body: { contentType: file.type, contentLength: file.size },
    schema: uploadTicketSchema,
    signal,
  });
  await putWithProgress(ticket.url, ticket.headers, file, onProgress, signal);
  return apiFetch(`${base}/buyer-photos`, { method: 'POST', body: { key: ticket.key }, schema: buyerPhotoSchema, signal });
}
