import type { OrderView } from '../../../shared/schemas/checkout.ts';
import type { PrepSettings } from '../../../shared/schemas/prep.ts';
import { AUTO_LEVELS_CLIP } from '../../../shared/orders/prep-pipeline.ts';
import type { MockupJob, MockupLook } from '../designer/mockup-protocol.ts';

type Item = OrderView['items'][number];

/**
 * What the mock-up worker draws for an item with its prep settings. Sharpening is given in
 * output pixels; the mock-up is far coarser than the burn, so its radius is scaled down with it.
 */
export function prepMockup(item: Item, prep: PrepSettings, screenWidth: number): { look: MockupLook; job: Pick<MockupJob, 'tone' | 'sharpen' | 'autoLevelsClip' | 'cutout'> } {
  const outputWidth = (item.look.areaWidthMm / 25.4) * prep.linesPerInch;
  const scale = screenWidth / outputWidth;
  return {
    look: { ...item.look, tone: prep.negative ? 'negative' : 'positive', halftoneMethod: prep.halftoneMethod, linesPerInch: prep.linesPerInch },
    job: {
      tone: { brightness: prep.brightness, contrast: prep.contrast, gamma: prep.gamma },
      sharpen: { amount: prep.sharpenAmount, radius: Math.max(0.5, prep.sharpenRadius * scale), threshold: prep.sharpenThreshold },
      autoLevelsClip: prep.autoLevels ? AUTO_LEVELS_CLIP : undefined,
      cutout: { cutout: prep.cutout, featherRadius: prep.featherRadius * scale },
    },
  };
}
