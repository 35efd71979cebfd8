import { useEffect, useRef } from 'react';
import type { OrderView } from '../../../../shared/schemas/checkout.ts';
import { useMockup } from '../use-mockup.ts';
import { drawInscription } from '../inscription.ts';

type Item = OrderView['items'][number];

/** An ordered item drawn again as it will burn, from its stored placement and its recipe's prep, in the blank's shape. */
export function ItemMockup({ item, width = 220 }: { item: Item; width?: number }) {
  const { look, placement, photo } = item;
  const size = { width, height: Math.round((width * look.areaHeightMm) / look.areaWidthMm) };
  const mockup = useMockup(photo);
  const canvas = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    if (mockup.ready) mockup.render({ size, placement, look, areaWidthMm: look.areaWidthMm, view: 'burn' });
  }, [mockup.ready]); // eslint-disable-line react-hooks/exhaustive-deps
  useEffect(() => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx || !mockup.result) return;
    ctx.drawImage(mockup.result.image, 0, 0);
    if (item.inscription) drawInscription(ctx, item.inscription, size, look.markColour);
  }, [mockup.result]); // eslint-disable-line react-hooks/exhaustive-deps
  return (
    <div className="inline-flex rounded-lg bg-graphite-100 p-3">
      <canvas ref={canvas} width={size.width} height={size.height} role="img" aria-label={`${item.blankName} as it will burn`} />
    </div>
  );
}
