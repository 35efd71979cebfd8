import { pixelsFor } from './sizing.ts';

/**
 * Estimated time of a raster engraving. The head sweeps one row per line of the engrave file:
 * rows = the file's pixel height (`pixelsFor`, the same rounding as placement). Each row travels the image width plus an overscan at both ends (room to reach
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
  const rows = pixelsFor(heightMm, linesPerInch);
  const perRow = (widthMm + 2 * overscanMm) / speedMmPerSecond + turnaroundSeconds;
  return rows * perRow * passes;
}

/** A machine speed in its own unit as mm/s, or null when the unit is a share of the machine's top speed. */
export function speedInMmPerSecond(speed: number, unit: 'mm/s' | 'in/s' | 'percent'): number | null {
  if (unit === 'mm/s') return speed;
  if (unit === 'in/s') return speed * 25.4;
  return null;
}

/** "1 h 05 min", "12 min 30 s", "45 s": rounded to the second. */
export function formatBurnTime(seconds: number): string {
  const total = Math.round(seconds);
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  if (h) return `${h} h ${String(m).padStart(2, '0')} min`;
  if (m) return `${m} min ${String(s).padStart(2, '0')} s`;
  return `${s} s`;
}
