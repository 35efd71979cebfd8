import type { GrayF } from './image.ts';

/** A normalised 1-D Gaussian of standard deviation sigma, truncated at 3σ. */
export function gaussianKernel(sigma: number): Float32Array {
  const radius = Math.max(1, Math.ceil(3 * sigma));
  const kernel = new Float32Array(2 * radius + 1);
  let sum = 0;
  for (let i = -radius; i <= radius; i++) {
    const w = Math.exp(-(i * i) / (2 * sigma * sigma));
    kernel[i + radius] = w;
    sum += w;
  }
  for (let i = 0; i < kernel.length; i++) kernel[i]! /= sum;
  return kernel;
}

/** Separable Gaussian blur; edges repeat their last pixel. sigma ≤ 0 returns a copy. */
export function gaussianBlur(image: GrayF, sigma: number): GrayF {
  const { width, height, data } = image;
  if (sigma <= 0) return { width, height, data: data.slice() };
  const kernel = gaussianKernel(sigma);
  const radius = (kernel.length - 1) / 2;
  const temp = new Float32Array(data.length);
  const out = new Float32Array(data.length);
  for (let y = 0; y < height; y++) {
    const row = y * width;
    for (let x = 0; x < width; x++) {
      let acc = 0;
      for (let k = -radius; k <= radius; k++) {
        const sx = x + k < 0 ? 0 : x + k >= width ? width - 1 : x + k;
        acc += data[row + sx]! * kernel[k + radius]!;
      }
      temp[row + x] = acc;
    }
  }
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      let acc = 0;
      for (let k = -radius; k <= radius; k++) {
        const sy = y + k < 0 ? 0 : y + k >= height ? height - 1 : y + k;
        acc += temp[sy * width + x]! * kernel[k + radius]!;
      }
      out[y * width + x] = acc;
    }
  }
  return { width, height, data: out };
}
