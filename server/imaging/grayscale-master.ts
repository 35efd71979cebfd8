import sharp from 'sharp';

/**
 * The grayscale master for studios that halftone in their own machine software: the prepared
 * 8-bit gray with the cut-out as alpha (transparent outside the subject), its resolution in pHYs.
 * Takes `prepareMaster`'s result (shared/imaging/pipeline.ts).
 */
export async function encodeGrayscaleMaster(master: { width: number; height: number; gray: Uint8Array; alpha: Uint8Array }, dpi: number): Promise<Buffer> {
  const { width, height, gray, alpha } = master;
  const pixels = Buffer.alloc(width * height * 2);
  for (let i = 0; i < gray.length; i++) {
    pixels[2 * i] = gray[i]!;
    pixels[2 * i + 1] = alpha[i]!;
  }
  return sharp(pixels, { raw: { width, height, channels: 2 }, limitInputPixels: false }).toColourspace('b-w').png({ compressionLevel: 6 }).withDensity(dpi).toBuffer();
}
