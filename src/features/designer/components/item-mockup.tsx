import { useEffect, useRef } from 'react';
import type { OrderView } from '#shared/schemas/checkout.ts';
import { useSteadyValue } from '#src/lib/use-steady-value.ts';
import { useMockup } from '../use-mockup.ts';
import { drawInscription } from '../inscription.ts';

type Item = OrderView['items'][number];

/** An ordered item drawn again as it will burn, from its stored placement and its recipe's prep, in the blank's shape. */
export function ItemMockup({ item, width = 220 }: { item: Item; width?: number }) {
  const { look, placement, photo } = item;
  const job = useSteadyValue({
    size: { width, height: Math.round((width * look.areaHeightMm) / look.areaWidthMm) },
    placement,
    look,
    areaWidthMm: look.areaWidthMm,
    view: 'burn' as const,
  });
  const { size } = job;
  const mockup = useMockup(photo);
  const { ready, render, result } = mockup;
  const canvas = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    if (ready) render(job);
  }, [ready, render, job]);
  const { inscription } = item;
  useEffect(() => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx || !result) return;
    ctx.drawImage(result.image, 0, 0);
    if (inscription) drawInscription(ctx, inscription, size, job.look.markColour);
  }, [result, inscription, size, job.look.markColour]);
  return (
    <div className="inline-flex rounded-lg bg-graphite-100 p-3">
      <canvas ref={canvas} width={size.width} height={size.height} role="img" aria-label={`${item.blankName} as it will burn`} />
    </div>
  );
}
