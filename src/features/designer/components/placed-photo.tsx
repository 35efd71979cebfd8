import { useEffect, useRef } from 'react';
import type { Placement } from '../../../../shared/schemas/checkout.ts';
import type { MockupJob, MockupLook } from '../mockup-protocol.ts';
import { useMockup } from '../use-mockup.ts';

/**
 * A photo as placed in its engraving area, at a given screen size: the plain photo, or as it
 * will burn. Drawn by the mock-up worker from the same placement the engrave file uses.
 */
export function PlacedPhoto({ photo, placement, look, size, view, label, prep }: { photo: { previewUrl: string; previewWidth: number; width: number }; placement: Placement; look: MockupLook; size: { width: number; height: number }; view: 'photo' | 'burn'; label: string; prep?: Pick<MockupJob, 'tone' | 'sharpen' | 'autoLevelsClip' | 'cutout'> }) {
  const mockup = useMockup(photo);
  const canvas = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    if (mockup.ready) mockup.render({ size, placement, look, view, ...prep });
  }, [mockup.ready, JSON.stringify(placement), JSON.stringify(prep), JSON.stringify(look), size.width, size.height, view]); // eslint-disable-line react-hooks/exhaustive-deps
  useEffect(() => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx || !mockup.result) return;
    ctx.clearRect(0, 0, size.width, size.height);
    ctx.drawImage(mockup.result.image, 0, 0);
  }, [mockup.result, size.width, size.height]);
  return <canvas ref={canvas} width={size.width} height={size.height} role="img" aria-label={label} className="max-w-full" style={{ background: look.surfaceColour }} />;
}
