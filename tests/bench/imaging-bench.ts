import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, totalmem, tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { errorDiffuse } from '#shared/imaging/halftone/error-diffusion.ts';
import type { GrayF } from '#shared/imaging/image.ts';
import { recipePrep } from '#shared/orders/prep-pipeline.ts';
import { burnPiece } from '#server/imaging/piece.ts';
import { encodeBitmapPng } from '#server/imaging/png-1bit.ts';
import { measureMockupInChromium } from './mockup-bench.ts';

/**
 * Imaging benchmarks, ours beside reference programs on the same pixels and the same machine.
 * Medians of several runs after a warm-up; wall-clock time. Not a test: it asserts nothing.
 */
const work = mkdtempSync(join(tmpdir(), 'etchwell-bench-'));
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const time = async (fn: () => unknown | Promise<unknown>, runs = 3) => {
  const out: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t = performance.now();
    await fn();
    out.push(performance.now() - t);
  }
  return median(out);
};
const rows: Array<[string, string, string]> = [];
const row = (what: string, ours: string, reference: string) => {
  rows.push([what, ours, reference]);
  console.log(`  ${what.padEnd(58)} ${ours.padEnd(20)} ${reference}`);
};

async function grayOf(photo: string, width: number, height: number): Promise<GrayF & { raw: Buffer }> {
  const raw = await sharp(photo).resize(width, height, { fit: 'fill', kernel: 'lanczos3' }).greyscale().raw().toBuffer();
  return { width, height, data: Float32Array.from(raw), raw };
}

/** Pillow's convert('1') on raw gray, timed inside Python around the conversion only. */
function pillowMs(raw: Buffer, width: number, height: number): number {
  const path = join(work, 'in.raw');
  writeFileSync(path, raw);
  const script = `import time; from PIL import Image
img = Image.frombytes('L', (${width}, ${height}), open('${path}', 'rb').read())
img.convert('1')
ts = []
for _ in range(3):
    t = time.perf_counter(); img.convert('1'); ts.append(time.perf_counter() - t)
print(sorted(ts)[1] * 1000)`;
  return Number(execFileSync('/usr/bin/python3', ['-c', script], { encoding: 'utf8' }).trim());
}

export async function runImagingBench(photoDir: string): Promise<void> {
  const photo = join(photoDir, 'astronaut.png');
  console.log(
    `\nImaging benchmarks on ${cpus().length} × ${cpus()[0]?.model ?? 'CPU'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`,
  );
  console.log(`  ${'measure'.padEnd(58)} ${'Etchwell'.padEnd(20)} reference\n`);

  // Warm-up so the optimising compiler has seen the loops.
  const warm = await grayOf(photo, 600, 600);
  errorDiffuse(warm, { kernel: 'floyd-steinberg' });
  errorDiffuse(warm, { kernel: 'jarvis-judice-ninke' });

  for (const [label, w, h] of [
    ['8 × 10 in at 360 (10.4 MP)', 2880, 3600],
    ['8 × 10 in at 1000 (80 MP)', 8000, 10000],
  ] as const) {
    const gray = await grayOf(photo, w, h);
    const mp = (w * h) / 1e6;
    const fs = await time(() => errorDiffuse(gray, { kernel: 'floyd-steinberg' }));
    const jjn = await time(() => errorDiffuse(gray, { kernel: 'jarvis-judice-ninke' }));
    const pil = pillowMs(gray.raw, w, h);
    row(`Floyd–Steinberg, ${label}, MP/s`, (mp / (fs / 1000)).toFixed(0), `Pillow convert('1'): ${(mp / (pil / 1000)).toFixed(0)}`);
    row(`Jarvis–Judice–Ninke, ${label}, MP/s`, (mp / (jjn / 1000)).toFixed(0), 'target ≥ 100');
  }

  // The engrave file from a 12 MP JPEG: place, gray, sharpen, halftone, PNG.
  const jpeg = join(work, 'photo-12mp.jpg');
  await sharp(photo).resize(4000, 3000, { fit: 'fill' }).jpeg({ quality: 90 }).toFile(jpeg);
  const bytes = readFileSync(jpeg);
  // The product's own render call (`burnPiece`, as the render job makes it), with the recipe's
  // prep for a positive Floyd–Steinberg burn at 360 lines per inch.
  const piece = {
    placement: { crop: { left: 800, top: 0, width: 2400, height: 3000 } },
    area: { widthMm: 203.2, heightMm: 254 },
    shape: 'rectangle' as const,
    inscription: null,
  };
  const prep = recipePrep({ tone: 'positive', halftoneMethod: 'floyd-steinberg', linesPerInch: 360 });
  const ours = await time(async () => {
    const { bitmap } = await burnPiece(bytes, piece, prep);
    writeFileSync(join(work, 'ours.png'), encodeBitmapPng(bitmap, 360));
  });
  const palette = join(work, 'bw.png');
  await sharp({ create: { width: 2, height: 1, channels: 3, background: '#000000' } })
    .composite([{ input: { create: { width: 1, height: 1, channels: 3, background: '#ffffff' } }, left: 1, top: 0 }])
    .png()
    .toFile(palette);
  const magick = await time(() =>
    execFileSync(
      '/usr/bin/convert',
      [
        jpeg,
        '-crop',
        '2400x3000+800+0',
        '+repage',
        '-resize',
        '2880x3600!',
        '-colorspace',
        'Gray',
        '-unsharp',
        '0x2+1.5+0.004',
        '-dither',
        'FloydSteinberg',
        '-remap',
        palette,
        '-type',
        'Bilevel',
        join(work, 'magick.png'),
      ],
      {
        env: { ...process.env, MAGICK_CONFIGURE_PATH: work },
      },
    ),
  );
  row(
    'Engrave file: 12 MP JPEG → 8 × 10 in at 360, seconds',
    (ours / 1000).toFixed(2),
    `ImageMagick convert: ${(magick / 1000).toFixed(2)} (${(magick / ours).toFixed(1)}× ours)`,
  );

  // The grayscale master at 1000 ppi as the render job writes it (`writePieceMaster`, after the
  // burn whose levels and cut-out it reuses), in a child process so its peak memory is its own.
  const child = `
    import { readFileSync } from 'node:fs';
    import { burnPiece, writePieceMaster } from '${join(process.cwd(), 'server/imaging/piece.ts')}';
    import { recipePrep } from '${join(process.cwd(), 'shared/orders/prep-pipeline.ts')}';
    const bytes = readFileSync('${jpeg}');
    const piece = ${JSON.stringify(piece)};
    const prep = recipePrep({ tone: 'positive', halftoneMethod: 'floyd-steinberg', linesPerInch: 360 });
    const burned = await burnPiece(bytes, piece, prep);
    const t = performance.now();
    const master = await writePieceMaster(piece, prep, burned, 1000);
    console.log(JSON.stringify({ ms: performance.now() - t, width: master.width, height: master.height, maxRssKb: process.resourceUsage().maxRSS }));`;
  writeFileSync(join(process.cwd(), '.data', 'bench-master.ts'), child);
  const master = JSON.parse(
    execFileSync(process.execPath, ['--import', 'tsx', join(process.cwd(), '.data', 'bench-master.ts')], { encoding: 'utf8' })
      .trim()
      .split('\n')
      .pop()!,
  );
  row(
    `Grayscale master, 8 × 10 in at 1000 ppi (${master.width} × ${master.height}): seconds / peak RSS of the render process`,
    `${(master.ms / 1000).toFixed(2)} s / ${(master.maxRssKb / 1024).toFixed(0)} MB`,
    'target ≤ 5 s / ≤ 700 MB',
  );
  const mockup = await measureMockupInChromium(process.cwd(), photo);
  row(
    'Mock-up re-render in Chromium at 800 × 1000, median ms per change',
    mockup.medianMs.toFixed(0),
    `target ≤ 50 (median of ${mockup.runs})`,
  );
  rmSync(work, { recursive: true, force: true });
}
