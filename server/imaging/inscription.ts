import { readFileSync } from 'node:fs';
import * as fontkit from 'fontkit';
import sharp from 'sharp';
import type { Bitmap } from '#shared/imaging/image.ts';
import { shapeMask, type BlankShape } from '#shared/imaging/shape.ts';
import type { Inscription } from '#shared/schemas/checkout.ts';
import { nunitoWoff } from '../lib/fonts.ts';

/**
 * The buyer's inscription, burned as solid marks on top of the halftoned photo. It is laid out
 * as the storefront draws it (src/features/designer/inscription.ts): Nunito at weight 600 (or
 * 800 for the bold choice), letter size a share of the area's height, centred, the last line's
 * baseline at 93 % of the height and 1.2 letter sizes between lines. The same font files the
 * browser uses are shaped with fontkit (kerning and ligatures, as browsers do) and filled by sharp.
 */
const fonts = new Map<Inscription['font'], fontkit.Font>();
function fontFor(choice: Inscription['font']): fontkit.Font {
  let font = fonts.get(choice);
  if (!font) {
    font = fontkit.create(readFileSync(nunitoWoff(choice === 'rounded-bold' ? 800 : 600))) as fontkit.Font;
    fonts.set(choice, font);
  }
  return font;
}

/** The inscription as SVG path data for an image of `width` × `height` pixels, or null when there is none. */
export function inscriptionPath(inscription: Inscription | null, width: number, height: number): string | null {
  const lines = inscription?.lines.filter((line) => line.trim()) ?? [];
  if (!inscription || !lines.length) return null;
  const font = fontFor(inscription.font);
  const px = Math.round(inscription.size * height);
  const scale = px / font.unitsPerEm;
  return lines
    .map((line, i) => {
      const run = font.layout(line);
      const advance = run.positions.reduce((sum, p) => sum + p.xAdvance, 0) * scale;
      let x = width / 2 - advance / 2;
      const baseline = height * 0.93 - (lines.length - 1 - i) * px * 1.2;
      return run.glyphs
        .map((glyph, g) => {
          const position = run.positions[g]!;
          // Font units have y upwards; the image's y goes down from the top.
          const d = glyph.path
            .scale(scale, -scale)
            .translate(x + position.xOffset * scale, baseline - position.yOffset * scale)
            .toSVG();
          x += position.xAdvance * scale;
          return d;
        })
        .join(' ');
    })
    .join(' ');
}

/**
 * Coverage of the inscription, 0–255 per pixel, or null when there is none: for the whole image,
 * or for the rows `band.top` … `band.top + band.rows − 1` of it (a large master is lettered band
 * by band, with the same layout). The letters are laid out on the area's rectangle; on a round or
 * oval piece their ends may reach past the blank's shape, so coverage there is cut away.
 */
export async function inscriptionCoverage(
  inscription: Inscription | null,
  width: number,
  height: number,
  shape: BlankShape,
  band = { top: 0, rows: height },
): Promise<Uint8Array | null> {
  const path = inscriptionPath(inscription, width, height);
  if (!path) return null;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${band.rows}" viewBox="0 ${band.top} ${width} ${band.rows}"><path d="${path}" fill="#000"/></svg>`;
  const { data } = await sharp(Buffer.from(svg), { density: 72, limitInputPixels: false })
    .ensureAlpha()
    .extractChannel(3)
    .raw()
    .toBuffer({ resolveWithObject: true });
  const coverage = new Uint8Array(data.buffer, data.byteOffset, data.length);
  const inShape = shapeMask(shape, width, height, band.top, band.rows);
  if (inShape) for (let i = 0; i < coverage.length; i++) if (!inShape[i]) coverage[i] = 0;
  return coverage;
}

/** Burns the inscription into a bitmap: every pixel at least half covered fires the laser (0). */
export function burnInscription(bitmap: Bitmap, coverage: Uint8Array | null): Bitmap {
  if (!coverage) return bitmap;
  for (let i = 0; i < coverage.length; i++) if (coverage[i]! >= 128) bitmap.data[i] = 0;
  return bitmap;
}

/**
 * The same on the grayscale master (8-bit gray and alpha), where the darkest gray burns hardest:
 * the letters become black and opaque, blended by their coverage at the edges.
 */
export function inscribeMaster(master: { gray: Uint8Array; alpha: Uint8Array }, coverage: Uint8Array | null): void {
  if (!coverage) return;
  for (let i = 0; i < coverage.length; i++) {
    const c = coverage[i]!;
    if (!c) continue;
    master.gray[i] = Math.round((master.gray[i]! * (255 - c)) / 255);
    master.alpha[i] = Math.max(master.alpha[i]!, c);
  }
}
