import { useState } from 'react';
import { useDropzone, type FileRejection } from 'react-dropzone';
import { IMAGE_UPLOAD_TYPES, MAX_IMAGE_UPLOAD_BYTES } from '#shared/schemas/uploads.ts';
import type { BlankPhotoView } from '#shared/schemas/catalog.ts';
import { Button } from '#src/components/ui/button.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { cx } from '#src/lib/cx.ts';
import { useAddPhoto, useRemovePhoto } from '../api/catalog.ts';

const MAX_PHOTOS = 8;
const accept = Object.fromEntries(IMAGE_UPLOAD_TYPES.map((type) => [type, []]));

function rejectionMessage({ file, errors }: FileRejection): string {
  const code = errors[0]?.code;
  if (code === 'file-too-large') return `${file.name} is larger than ${MAX_IMAGE_UPLOAD_BYTES / 1024 / 1024} MB.`;
  if (code === 'file-invalid-type') return `${file.name} is not a JPEG, PNG or WebP image.`;
  return `${file.name}: ${errors[0]?.message ?? 'cannot be used'}.`;
}

/** A blank's product photos: drop or choose files to add them, remove any. Owners only change them. */
export function PhotoPanel({
  slug,
  blankId,
  photos,
  canEdit,
}: {
  slug: string;
  blankId: string;
  photos: BlankPhotoView[];
  canEdit: boolean;
}) {
  const add = useAddPhoto(slug, blankId);
  const remove = useRemovePhoto(slug, blankId);
  const toast = useToast();
  const [progress, setProgress] = useState<{ done: number; total: number }>();

  async function upload(files: File[], rejections: FileRejection[]) {
    for (const rejection of rejections) toast.show(rejectionMessage(rejection), 'error');
    const room = MAX_PHOTOS - photos.length;
    if (files.length > room)
      toast.show(`A blank shows at most ${MAX_PHOTOS} photos; only the first ${Math.max(room, 0)} are added.`, 'error');
    const taken = files.slice(0, Math.max(room, 0));
    for (const [index, file] of taken.entries()) {
      setProgress({ done: index, total: taken.length });
      try {
        await add.mutateAsync(file);
      } catch (error) {
        toast.show(`${file.name}: ${(error as Error).message}`, 'error');
      }
    }
    setProgress(undefined);
    if (taken.length) toast.show(taken.length === 1 ? 'Photo added.' : `${taken.length} photos processed.`, 'success');
  }

  const dropzone = useDropzone({
    accept,
    maxSize: MAX_IMAGE_UPLOAD_BYTES,
    onDrop: (files, rejections) => void upload(files, rejections),
    disabled: !canEdit || Boolean(progress),
  });

  async function onRemove(photo: BlankPhotoView) {
    try {
      await remove.mutateAsync(photo.id);
    } catch (error) {
      toast.show((error as Error).message, 'error');
    }
  }

  return (
    <div className="flex flex-col gap-4">
      {photos.length === 0 && !canEdit && <p className="text-sm text-graphite-500">No product photos yet.</p>}
      {photos.length > 0 && (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          {photos.map((photo, index) => (
            <li key={photo.id} className="group relative overflow-hidden rounded-lg border border-graphite-100 bg-birch-50">
              <img
                src={photo.url}
                alt={`Product photo ${index + 1}`}
                width={photo.width}
                height={photo.height}
                className="aspect-square w-full object-cover"
                loading="lazy"
              />
              {canEdit && (
                <Button
                  size="sm"
                  variant="secondary"
                  className="absolute right-2 top-2"
                  onClick={() => void onRemove(photo)}
                  aria-label={`Remove product photo ${index + 1}`}
                >
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
      {canEdit && photos.length < MAX_PHOTOS && (
        <div
          {...dropzone.getRootProps({
            className: cx(
              'flex cursor-pointer flex-col items-center justify-center gap-1 rounded-lg border-2 border-dashed px-6 py-8 text-center text-sm transition',
              dropzone.isDragActive ? 'border-accent bg-ember-50' : 'border-graphite-200 bg-birch-50 hover:border-graphite-300',
            ),
          })}
        >
          <input {...dropzone.getInputProps({ 'aria-label': 'Add product photos' })} />
          {progress ? (
            <p className="font-semibold" aria-live="polite">
              Uploading photo {progress.done + 1} of {progress.total}…
            </p>
          ) : (
            <>
              <p className="font-semibold text-graphite-800">Drop product photos here, or click to choose</p>
              <p className="text-graphite-500">
                JPEG, PNG or WebP, up to {MAX_IMAGE_UPLOAD_BYTES / 1024 / 1024} MB each; at most {MAX_PHOTOS} per blank.
              </p>
            </>
          )}
        </div>
      )}
    </div>
  );
}
