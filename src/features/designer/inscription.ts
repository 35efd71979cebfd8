import type { Inscription } from '#shared/schemas/checkout.ts';

/**
 * Draws an inscription on a mock-up canvas: centred near the bottom of the engraving area, in
 * the bundled Nunito, letter height a share of the area's height. The same drawing is used in
 * the designer and wherever an ordered item is shown again.
 */
export function drawInscription(
  ctx: CanvasRenderingContext2D,
  inscription: Pick<Inscription, 'lines' | 'font' | 'size'>,
  size: { width: number; height: number },
  colour: string,
  onPhoto = false,
): void {
  const lines = inscription.lines.filter((l) => l.trim());
  if (!lines.length) return;
  const px = Math.round(inscription.size * size.height);
  ctx.save();
  ctx.font = `${inscription.font === 'rounded-bold' ? 800 : 600} ${px}px Nunito, sans-serif`;
  ctx.textAlign = 'center';
  ctx.fillStyle = colour;
  ctx.shadowColor = onPhoto ? 'rgb(0 0 0 / 0.6)' : 'transparent';
  ctx.shadowBlur = onPhoto ? 4 : 0;
  lines.forEach((line, i) => ctx.fillText(line, size.width / 2, size.height * 0.93 - (lines.length - 1 - i) * px * 1.2));
  ctx.restore();
}
