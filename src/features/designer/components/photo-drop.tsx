import { useRef, useState } from 'react';
import { AppError } from '#shared/errors.ts';
import { useDropzone, type FileRejection } from 'react-dropzone';
import { MAX_IMAGE_UPLOAD_BYTES } from '#shared/schemas/uploads.ts';
import type { BuyerPhotoView } from '#shared/schemas/photos.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { cx } from '#src/lib/cx.ts';
import { toUploadable, uploadBuyerPhoto } from '../upload-photo.ts';

const MB = MAX_IMAGE_UPLOAD_BYTES / 1024 / 1024;
const accept = { 'image/jpeg': [], 'image/png': [], 'image/webp': [], 'image/heic': ['.heic'], 'image/heif': ['.heif'] };

type State =
  | { step: 'idle' }
  | { step: 'converting'; name: string }
  | { step: 'uploading'; name: string; share: number }
  | { step: 'checking'; name: string }
  | { step: 'failed'; name: string; message: string; file: File };

/**
 * The photo drop: the limits said up front, HEIC converted in the browser, a real progress bar
 * for the upload straight to storage, cancel while it runs and retry after a failure.
 */
export function PhotoDrop({
  studioSlug,
  hasPhoto,
  onPhoto,
}: {
  studioSlug: string;
  hasPhoto: boolean;
  onPhoto(photo: BuyerPhotoView): void;
}) {
  const [state, setState] = useState<State>({ step: 'idle' });
  const abort = useRef<AbortController | undefined>(undefined);

  async function send(original: File) {
    const controller = new AbortController();
    abort.current = controller;
    try {
      setState({ step: 'converting', name: original.name });
      const file = await toUploadable(original);
      setState({ step: 'uploading', name: original.name, share: 0 });
      const photo = await uploadBuyerPhoto(
        studioSlug,
        file,
        (share) => setState({ step: share >= 1 ? 'checking' : 'uploading', name: original.name, share } as State),
        controller.signal,
      );
      setState({ step: 'idle' });
      onPhoto(photo);
    } catch (error) {
      if ((error as Error).name === 'AbortError') return setState({ step: 'idle' });
      // A refused field (the size, the type) says more than the form's general message.
      const message = (error instanceof AppError && error.issues?.[0]?.message) || (error as Error).message;
      setState({ step: 'failed', name: original.name, message, file: original });
    }
  }

  function onDrop(files: File[], rejections: FileRejection[]) {
    const rejected = rejections[0];
    if (rejected) {
      const code = rejected.errors[0]?.code;
      const message =
        code === 'file-too-large'
          ? `This file is larger than ${MB} MB. Please choose a smaller copy.`
          : code === 'file-invalid-type'
            ? 'This is not a photo we can use. Please choose a JPEG, PNG, WebP or HEIC photo.'
            : 'Please drop one photo.';
      return setState({ step: 'failed', name: rejected.file.name, message, file: rejected.file });
    }
    // An empty file passes the type check but holds no photo: say so before any upload.
    if (files[0]?.size === 0)
      return setState({
        step: 'failed',
        name: files[0].name,
        message: 'This file is empty (0 bytes): it may not have finished saving or copying. Please choose the photo again.',
        file: files[0],
      });
    if (files[0]) void send(files[0]);
  }

  const busy = state.step === 'converting' || state.step === 'uploading' || state.step === 'checking';
  const dropzone = useDropzone({ accept, maxSize: MAX_IMAGE_UPLOAD_BYTES, multiple: false, onDrop, disabled: busy });

  return (
    <div className="flex flex-col gap-3">
      <div
        {...dropzone.getRootProps({
          className: cx(
            'flex cursor-pointer flex-col items-center justify-center gap-1 rounded-lg border-2 border-dashed px-6 py-6 text-center text-sm transition',
            dropzone.isDragActive ? 'border-accent bg-ember-50' : 'border-graphite-200 bg-birch-50 hover:border-graphite-300',
            busy && 'cursor-progress opacity-70',
          ),
        })}
      >
        <input {...dropzone.getInputProps({ 'aria-label': hasPhoto ? 'Choose another photo' : 'Choose your photo' })} />
        <p className="font-semibold text-graphite-800">
          {hasPhoto ? 'Drop another photo here, or click to choose' : 'Drop your photo here, or click to choose'}
        </p>
        <p className="text-graphite-500">
          JPEG, PNG, WebP or HEIC (from phones), up to {MB} MB. The original, not a screenshot, engraves best.
        </p>
      </div>
      {busy && (
        <div className="flex flex-col gap-2" aria-live="polite">
          <div className="flex items-center justify-between text-sm">
            <span className="font-semibold">
              {state.step === 'converting'
                ? `Preparing ${state.name}…`
                : state.step === 'checking'
                  ? 'Checking the photo…'
                  : `Uploading ${state.name}…`}
            </span>
            <Button size="sm" variant="quiet" onClick={() => abort.current?.abort()}>
              Cancel
            </Button>
          </div>
          <progress
            className="h-2 w-full overflow-hidden rounded-full accent-[var(--color-accent)]"
            max={1}
            value={state.step === 'uploading' ? state.share : state.step === 'checking' ? 1 : undefined}
            aria-label="Upload progress"
          />
        </div>
      )}
      {state.step === 'failed' && (
        <Notice tone="error" title={`${state.name} could not be used`}>
          <p>{state.message}</p>
          <Button size="sm" variant="secondary" className="mt-2" onClick={() => void send(state.file)}>
            Try again
          </Button>
        </Notice>
      )}
    </div>
  );
}
