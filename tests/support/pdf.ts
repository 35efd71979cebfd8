import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import jsQR from 'jsqr';
import sharp from 'sharp';

/**
 * Reads PDFs back with Debian's Poppler (installed by `npm test`): the text as pdftotext finds
 * it, the page count as pdfinfo reports it, and the first page's QR code, rendered by pdftoppm
 * and decoded by jsQR.
 */
export function pdfText(pdf: Uint8Array): string {
  return execFileSync('/usr/bin/pdftotext', ['-layout', '-', '-'], { input: pdf, encoding: 'utf8' });
}

export function pdfPages(pdf: Uint8Array): number {
  const info = execFileSync('/usr/bin/pdfinfo', ['-'], { input: pdf, encoding: 'utf8' });
  return Number(/^Pages:\s+(\d+)/m.exec(info)?.[1]);
}

export async function pdfFirstPageQr(pdf: Uint8Array): Promise<string | undefined> {
  const dir = mkdtempSync(join(tmpdir(), 'etchwell-pdf-'));
  try {
    execFileSync('/usr/bin/pdftoppm', ['-png', '-r', '150', '-f', '1', '-l', '1', '-singlefile', '-', join(dir, 'page')], { input: pdf });
    const { data, info } = await sharp(readFileSync(join(dir, 'page.png')))
      .ensureAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    return jsQR(new Uint8ClampedArray(data.buffer, data.byteOffset, data.length), info.width, info.height)?.data;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
