import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * Runs Debian's Pillow (python3-pil, with Debian's own /usr/bin/python3) on raw 8-bit gray
 * pixels and returns its raw output. `npm test` installs the package when it is missing.
 */
const PYTHON = '/usr/bin/python3';

export function pillowAvailable(): boolean {
  try {
    execFileSync(PYTHON, ['-c', 'import PIL'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

export function runPillow(script: string, input: { width: number; height: number; data: Uint8Array }): Buffer {
  if (!pillowAvailable()) throw new Error("Pillow is missing: `npm test` installs Debian's python3-pil; run the tests through it.");
  const dir = mkdtempSync(join(tmpdir(), 'etchwell-pillow-'));
  try {
    const inPath = join(dir, 'in.raw');
    const outPath = join(dir, 'out.raw');
    writeFileSync(inPath, input.data);
    const program = [
      'import sys',
      'from PIL import Image, ImageFilter',
      `img = Image.frombytes('L', (${input.width}, ${input.height}), open(${JSON.stringify(inPath)}, 'rb').read())`,
      script,
      `open(${JSON.stringify(outPath)}, 'wb').write(out.tobytes())`,
    ].join('\n');
    execFileSync(PYTHON, ['-c', program], { stdio: ['ignore', 'ignore', 'pipe'] });
    return readFileSync(outPath);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Reads an image file with Pillow into raw 8-bit gray (BT.601, as Pillow's convert('L')). */
export function pillowReadGray(path: string): { width: number; height: number; data: Uint8Array } {
  if (!existsSync(path)) throw new Error(`reference photo missing: ${path}`);
  const size = execFileSync(PYTHON, ['-c', `from PIL import Image; i = Image.open(${JSON.stringify(path)}); print(i.size[0], i.size[1])`], {
    encoding: 'utf8',
  })
    .trim()
    .split(' ')
    .map(Number);
  const data = execFileSync(
    PYTHON,
    ['-c', `import sys; from PIL import Image; sys.stdout.buffer.write(Image.open(${JSON.stringify(path)}).convert('L').tobytes())`],
    { maxBuffer: 64 * 1024 * 1024 },
  );
  return { width: size[0]!, height: size[1]!, data: new Uint8Array(data) };
}

/** Unpacks Pillow's mode '1' bytes (8 pixels a byte, most significant first, rows padded). */
export function unpackBits(packed: Buffer, width: number, height: number): Uint8Array {
  const out = new Uint8Array(width * height);
  const stride = Math.ceil(width / 8);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) out[y * width + x] = (packed[y * stride + (x >> 3)]! >> (7 - (x & 7))) & 1;
  }
  return out;
}

/** Where `npm test` unpacks the open-licensed photographs of Debian's python3-skimage. */
export const referencePhotoDir = join(import.meta.dirname, '..', '..', '.data', 'reference-photos');

/** What Pillow reads from an image file's bytes: its mode, size and the resolution it records. */
export function pillowImageInfo(bytes: Uint8Array): {
  format: string;
  mode: string;
  width: number;
  height: number;
  dpi: [number, number] | null;
} {
  const out = execFileSync(
    PYTHON,
    [
      '-c',
      'import sys, io, json; from PIL import Image; i = Image.open(io.BytesIO(sys.stdin.buffer.read())); print(json.dumps({"format": i.format, "mode": i.mode, "width": i.size[0], "height": i.size[1], "dpi": [float(v) for v in i.info["dpi"]] if "dpi" in i.info else None}))',
    ],
    { input: bytes, encoding: 'utf8' },
  );
  return JSON.parse(out);
}

/** Pillow's view of a PNG file: mode, size, dpi and raw bytes (Debian python3-pil). */
export function pillowOpen(png: Buffer): { mode: string; size: [number, number]; dpi: [number, number]; bytes: Buffer } {
  const dir = mkdtempSync(join(tmpdir(), 'etchwell-pillow-'));
  try {
    const path = join(dir, 'in.png');
    writeFileSync(path, png);
    const script = `import json,sys; from PIL import Image; i=Image.open(${JSON.stringify(path)}); print(json.dumps({'mode': i.mode, 'size': i.size, 'dpi': i.info.get('dpi')})); sys.stdout.flush(); open(${JSON.stringify(path + '.raw')}, 'wb').write(i.tobytes())`;
    const facts = JSON.parse(execFileSync(PYTHON, ['-c', script], { encoding: 'utf8' }));
    return { ...facts, bytes: readFileSync(`${path}.raw`) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
