import { inchesToMm, mmToInches } from './imaging/sizing.ts';

/**
 * Lengths are stored in mm and shown in the studio's unit. Display values are rounded to what a
 * person types: hundredths of an inch (0.254 mm), tenths of a millimetre.
 */
export type LengthUnit = 'in' | 'mm';
export const LENGTH_UNIT_DECIMALS: Record<LengthUnit, number> = { in: 2, mm: 1 };

const round = (value: number, decimals: number) => Math.round(value * 10 ** decimals) / 10 ** decimals;

export const mmToUnit = (mm: number, unit: LengthUnit) => round(unit === 'in' ? mmToInches(mm) : mm, LENGTH_UNIT_DECIMALS[unit]);
/** The same, rounded down: for a largest size offered, which must not grow past what fits. */
export const mmToUnitDown = (mm: number, unit: LengthUnit) => {
  const scale = 10 ** LENGTH_UNIT_DECIMALS[unit];
  return Math.floor((unit === 'in' ? mmToInches(mm) : mm) * scale + 1e-9) / scale;
};
export const unitToMm = (value: number, unit: LengthUnit) => (unit === 'in' ? inchesToMm(value) : value);

/**
 * A machine's bed as a person would give it: to a tenth of an inch or a whole millimetre
 * ("35.4 × 23.6 in" for 900 × 600 mm, not 35.43 × 23.62).
 */
export const mmToBedUnit = (mm: number, unit: LengthUnit) => (unit === 'in' ? Math.round(mmToInches(mm) * 10) / 10 : Math.round(mm));
export const formatBedSize = (widthMm: number, heightMm: number, unit: LengthUnit) =>
  `${mmToBedUnit(widthMm, unit)} × ${mmToBedUnit(heightMm, unit)} ${unit}`;

/** "8 × 10 in", "210 × 297 mm". */
export function formatSize(widthMm: number, heightMm: number, unit: LengthUnit): string {
  return `${mmToUnit(widthMm, unit)} × ${mmToUnit(heightMm, unit)} ${unit}`;
}
