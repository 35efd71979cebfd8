/**
 * Estimated time of a raster engraving. The head sweeps one row per line: rows = area height ×
 * lines per inch. Each row travels the image width plus an overscan at both ends (room to reach
 * speed before the first dot) at the recipe's speed, and each row change costs a turnaround.
 * Passes multiply. Assumptions, stated on the job sheet: constant speed over the row, no
 * skipping of blank rows, acceleration folded into the overscan and the turnaround.
 */
export type BurnTimeInput = {
  widthMm: number;
  heightMm: number;
  linesPerInch: number;
  /** Head speed in mm/s (convert a machine's own unit before calling). */
  speedMmPerSecond: number;
  passes: number;
  /** Extra travel at each end of a row, in mm. Common practice: a few mm. */
  overscanMm?: number;
  /** Time to stop, step down a line and reverse, in seconds. */
  turnaroundSeconds?: number;
};

export function estimateBurnSeconds(input: BurnTimeInput): number {
  const { widthMm, heightMm, linesPerInch, speedMmPerSecond, passes, overscanMm = 5, turnaroundSeconds = 0.05 } = input;
  if (speedMmPerSecond <= 0) throw new RangeError('speed must be positive');
  const rows = Math.ceil((heightMm / 25.4) * linesPerInch);
  const perRow = (widthMm + 2 * overscanMm) / speedMmPerSecond + turnaroundSeconds;
  return rows * perRow * passes;
}
