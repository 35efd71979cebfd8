// Bundled for the Chromium benchmark: the same pipeline the storefront's mock-up will run.
import { renderBitmap } from '#shared/imaging/pipeline.ts';
import { renderMockup } from '#shared/imaging/mockup.ts';

(globalThis as unknown as { etchwellImaging: unknown }).etchwellImaging = { renderBitmap, renderMockup };
