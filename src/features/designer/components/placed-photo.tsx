import { useEffect, useRef } from 'react';
import type { Placement } from '#shared/schemas/checkout.ts';
import type { PrepSettings } from '#shared/schemas/prep.ts';
import type { MockupLook } from '../mockup-protocol.ts';
import { useSteadyValue } from '#src/lib/use-steady-value.ts';
import { useMockup } from '../use-mockup.ts';

/**
 * A photo as placed in its engraving area, at a given screen size: the plain photo, or as it
 * will burn, inside the blank's shape. Drawn by the mock-up worker from the same placement the
 * engrave file uses, with `prep` (at the burn's resolution; the recipe's own when absent).
 */
export function PlacedPhoto({
  photo,
  placement,
  look,
  areaWidthMm,
  size,
  view,
  label,
  prep,
}: {
  photo: { previewUrl: string; previewWidth: number; width: number };
  placement: Placement;
  look: MockupLook;
  areaWidthMm: number;
  size: { width: number; height: number };
  view: 'photo' | 'burn';
  label: string;
  prep?: PrepSettings;
}) {
  const mockup = useMockup(photo);
  const canvas = useRef<HTMLCanvasElement>(null);
  const job = useSteadyValue({ size, placement, look, areaWidthMm, view, prep });
  const { ready, render } = mockup;
  useEffect(() => {
    if (ready) render(job);
  }, [ready, render, job]);
  useEffect(() => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx || !mockup.result) return;
    ctx.clearRect(0, 0, size.width, size.height);
    ctx.drawImage(mockup.result.image, 0, 0);
  }, [mockup.result, size.width, size.height]);
  return <canvas ref={canvas} width={size.width} height={size.height} role="img" aria-label={label} className="max-w-full" />;
}
