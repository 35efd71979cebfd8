import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { build } from 'vite';
import { chromium } from 'playwright-core';

/**
 * Mock-up re-render in headless Chromium at 800 × 1000: the imaging core bundled as the browser
 * gets it, run on a real photo, timed per change (a new brightness each time) — tone, sharpen,
 * negative, Jarvis–Judice–Ninke and the drawing in the material's colours.
 */
export async function measureMockupInChromium(projectDir: string, photo: string): Promise<{ medianMs: number; runs: number }> {
  const outDir = join(projectDir, '.data', 'bench-browser');
  await build({
    configFile: false,
    logLevel: 'warn',
    build: {
      outDir,
      emptyOutDir: true,
      lib: {
        entry: join(projectDir, 'tests/bench/browser-entry.ts'),
        formats: ['iife'],
        name: 'etchwellBench',
        fileName: () => 'imaging.js',
      },
    },
  });
  const { data } = await sharp(photo).resize(800, 1000, { fit: 'cover' }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  try {
    const page = await browser.newPage();
    await page.goto('about:blank');
    await page.addScriptTag({ content: readFileSync(join(outDir, 'imaging.js'), 'utf8') });
    const times = await page.evaluate(async (pixels: number[]) => {
      type Imaging = {
        renderBitmap: (photo: unknown, settings: unknown) => { width: number; height: number; data: Uint8Array };
        renderMockup: (input: unknown) => unknown;
      };
      const imaging = (globalThis as unknown as { etchwellImaging: Imaging }).etchwellImaging;
      const photo = { width: 800, height: 1000, data: Uint8ClampedArray.from(pixels) };
      const out: number[] = [];
      for (let change = 0; change < 25; change++) {
        const t = performance.now();
        const bitmap = imaging.renderBitmap(photo, {
          negative: true,
          tone: { brightness: change - 12 },
          sharpen: { amount: 150, radius: 1.5, threshold: 2 },
          halftone: { method: 'jarvis-judice-ninke' },
        });
        imaging.renderMockup({ bitmap, shape: 'rounded-rectangle', surfaceColour: '#15171a', markColour: '#e9e6df' });
        out.push(performance.now() - t);
      }
      return out.slice(5); // the first runs include compiling
    }, Array.from(data));
    const sorted = [...times].sort((a, b) => a - b);
    return { medianMs: sorted[Math.floor(sorted.length / 2)]!, runs: times.length };
  } finally {
    await browser.close();
  }
}
