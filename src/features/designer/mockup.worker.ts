/// <reference lib="webworker" />
import { renderBitmap } from '#shared/imaging/pipeline.ts';
import { renderMockup } from '#shared/imaging/mockup.ts';
import { insideShape } from '#shared/imaging/shape.ts';
import { cutoutMask, hasCutout, maskFromAlpha } from '#shared/imaging/mask.ts';
import { pipelineSettings, prepAtWidth, recipePrep } from '#shared/orders/prep-pipeline.ts';
import type { MockupJob, MockupReply, MockupRequest } from './mockup-protocol.ts';

/**
 * The mock-up, off the page's thread: the photo placed in the engraving area at screen size,
 * then either shown as it is (clipped to the blank's shape) or run through the imaging core with
 * the same settings the burn uses, shrunk to the screen (`pipelineSettings` of `prepAtWidth`,
 * as the proof does), and drawn in the material's colours. Requests
 * that arrive while one is rendering collapse into the newest: a drag never queues up work.
 */
const scope = self as unknown as DedicatedWorkerGlobalScope;
let photo: { bitmap: ImageBitmap; scale: number } | undefined;
let pending: MockupJob | undefined;
let busy = false;

scope.onmessage = (event: MessageEvent<MockupRequest>) => {
  const message = event.data;
  if (message.type === 'photo') {
    photo?.bitmap.close();
    photo = { bitmap: message.bitmap, scale: message.previewScale };
    return;
  }
  pending = message.job;
  if (!busy) void drain();
};

async function drain(): Promise<void> {
  busy = true;
  while (pending) {
    const job = pending;
    pending = undefined;
    // Let newer requests in before starting: the newest wins.
    await new Promise((resolve) => setTimeout(resolve, 0));
    if (pending) continue;
    try {
      const started = performance.now();
      const image = render(job);
      const reply: MockupReply = { type: 'rendered', id: job.id, image, ms: performance.now() - started };
      scope.postMessage(reply, [image]);
    } catch (error) {
      const reply: MockupReply = { type: 'failed', id: job.id, message: (error as Error).message };
      scope.postMessage(reply);
    }
  }
  busy = false;
}

function render(job: MockupJob): ImageBitmap {
  const { width, height } = job.size;
  const canvas = new OffscreenCanvas(width, height);
  const ctx = canvas.getContext('2d', { willReadFrequently: true })!;
  if (photo) {
    const { crop, rotation, flipHorizontal } = job.placement;
    const pixelsPerPhotoPixel = width / crop.width;
    ctx.imageSmoothingQuality = 'high';
    ctx.translate(width / 2, height / 2);
    ctx.rotate((rotation * Math.PI) / 180);
    if (flipHorizontal) ctx.scale(-1, 1);
    ctx.scale(pixelsPerPhotoPixel / photo.scale, pixelsPerPhotoPixel / photo.scale);
    const centreX = (crop.left + crop.width / 2) * photo.scale;
    const centreY = (crop.top + crop.height / 2) * photo.scale;
    ctx.drawImage(photo.bitmap, -centreX, -centreY);
    ctx.setTransform(1, 0, 0, 1, 0, 0);
  }
  const placed = ctx.getImageData(0, 0, width, height);
  const prep = prepAtWidth(job.prep ?? recipePrep(job.look), job.areaWidthMm, width);
  const settings = pipelineSettings(prep, placed, job.look.shape);
  let out: ImageData;
  if (job.view === 'photo') {
    // With a cut-out, what is cut away stays faintly visible, so the brush can bring it back.
    const { cutout } = settings;
    const mask = cutout && hasCutout(cutout) ? cutoutMask(cutout.startMask ?? maskFromAlpha(placed), cutout) : undefined;
    for (let y = 0; y < height; y++) {
      for (let x = 0; x < width; x++) {
        const i = y * width + x;
        if (!insideShape(job.look.shape, x, y, width, height)) placed.data[i * 4 + 3] = 0;
        else if (mask) placed.data[i * 4 + 3] = Math.round(placed.data[i * 4 + 3]! * (0.22 + 0.78 * mask.data[i]!));
      }
    }
    out = placed;
  } else {
    const bitmap = renderBitmap(placed, settings);
    const mock = renderMockup({ bitmap, shape: job.look.shape, surfaceColour: job.look.surfaceColour, markColour: job.look.markColour });
    out = new ImageData(mock.data as Uint8ClampedArray<ArrayBuffer>, width, height);
  }
  ctx.putImageData(out, 0, 0);
  return canvas.transferToImageBitmap();
}
