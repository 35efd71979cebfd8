/**
 * Error-diffusion kernels as published, left to right: each entry sends weight/divisor of the
 * error to (x + dx, y + dy). Sources, one per kernel, beside each entry; mirrored (dx → −dx) on
 * right-to-left rows when scanning serpentine (R. Ulichney, Digital Halftoning, MIT Press, 1987).
 */
export type DiffusionKernel = {
  name: string;
  divisor: number;
  weights: ReadonlyArray<readonly [dx: number, dy: number, weight: number]>;
};

/** Builds the weights from the published layout: the current row right of `*`, then each next row from `from`. */
const rows = (current: number[], ...next: Array<{ from: number; weights: number[] }>): DiffusionKernel['weights'] => {
  const out: Array<[number, number, number]> = current.map((w, i) => [i + 1, 0, w]);
  next.forEach((row, index) => row.weights.forEach((w, i) => out.push([row.from + i, index + 1, w])));
  return out;
};

export const DIFFUSION_KERNELS = {
  /** R. W. Floyd, L. Steinberg, "An adaptive algorithm for spatial greyscale", Proc. SID 17(2), 1976. */
  'floyd-steinberg': { name: 'Floyd–Steinberg', divisor: 16, weights: rows([7], { from: -1, weights: [3, 5, 1] }) },
  /** J. F. Jarvis, C. N. Judice, W. H. Ninke, Computer Graphics and Image Processing 5(1), 1976. */
  'jarvis-judice-ninke': {
    name: 'Jarvis–Judice–Ninke',
    divisor: 48,
    weights: rows([7, 5], { from: -2, weights: [3, 5, 7, 5, 3] }, { from: -2, weights: [1, 3, 5, 3, 1] }),
  },
  /** P. Stucki, IBM Research Report RZ1060, 1981. */
  stucki: {
    name: 'Stucki',
    divisor: 42,
    weights: rows([8, 4], { from: -2, weights: [2, 4, 8, 4, 2] }, { from: -2, weights: [1, 2, 4, 2, 1] }),
  },
  /** D. Burkes, 1988 (tabulated in DHALF.TXT, 1991). */
  burkes: { name: 'Burkes', divisor: 32, weights: rows([8, 4], { from: -2, weights: [2, 4, 8, 4, 2] }) },
  /** F. Sierra, 1989 (DHALF.TXT). */
  sierra: { name: 'Sierra', divisor: 32, weights: rows([5, 3], { from: -2, weights: [2, 4, 5, 4, 2] }, { from: -1, weights: [2, 3, 2] }) },
  /** F. Sierra, 1990 (DHALF.TXT). */
  'sierra-two-row': { name: 'Sierra two-row', divisor: 16, weights: rows([4, 3], { from: -2, weights: [1, 2, 3, 2, 1] }) },
  /** F. Sierra, 1990 (DHALF.TXT). */
  'sierra-lite': { name: 'Sierra Lite', divisor: 4, weights: rows([2], { from: -1, weights: [1, 1] }) },
  /** B. Atkinson, mid-1980s (netpbm pamditherbw manual): passes on only 6/8 of the error. */
  atkinson: { name: 'Atkinson', divisor: 8, weights: rows([1, 1], { from: -1, weights: [1, 1, 1] }, { from: 0, weights: [1] }) },
} satisfies Record<string, DiffusionKernel>;

export type DiffusionKernelId = keyof typeof DIFFUSION_KERNELS;
