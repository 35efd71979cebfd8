import type { OrderView } from '#shared/schemas/checkout.ts';
import type { PrepSettings } from '#shared/schemas/prep.ts';
import type { MockupJob, MockupLook } from '#src/features/designer/index.ts';

type Item = OrderView['items'][number];

/**
 * What the mock-up worker draws for an item with staff's prep settings: the look of the prep
 * (tone, method, line density) and the prep itself, which the worker shrinks to the screen
 * exactly as the proof is shrunk (`prepAtWidth`).
 */
export function prepMockup(item: Item, prep: PrepSettings): { look: MockupLook; job: Pick<MockupJob, 'prep' | 'areaWidthMm'> } {
  return {
    look: {
      ...item.look,
      tone: prep.negative ? 'negative' : 'positive',
      halftoneMethod: prep.halftoneMethod,
      linesPerInch: prep.linesPerInch,
    },
    job: { prep, areaWidthMm: item.look.areaWidthMm },
  };
}
