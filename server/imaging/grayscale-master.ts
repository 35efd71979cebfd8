import sharp from 'sharp';
import type { GrayF } from '../../shared/imaging/image.ts';
import type { Mask } from '../../shared/imaging/mask.ts';

/**
 * The grayscale master for studios that halftone in their own machine software: the prepared
 * 8-bit gray with the cut-out as alpha (transparent outside the subject), its resolution in pHYs.
 */
export async function encodeGrayscaleMaster(gray: GrayF, mask: Mask, dpi: number): Promise<Buffer> {
  const pixels = Buffer.alloc(gray.width * gray.height * 2);
  for (let i = 0; i < gray.data.length; i++) {
    const v = Math.round(gray.data[i]!);
    pixels[2 * i] = v < 0 ? 0 : v > 255 ? 255 : v;
    pixels[2 * i + 1] = Math.round(Math.max(0, Math.min(1, mask.data[i]!)) * 255);
  }
  return sharp(pixels, { raw: { width: gray.width, height: gray.height, channels: 2 } }).toColourspace('b-w').png({ compressionLevel: 6 }).withDensity(dpi).toBuffer();
}
