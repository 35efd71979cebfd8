import { HALFTONE_METHODS, type HalftoneMethod } from '#shared/imaging/halftone/halftone.ts';
import {
  BLANK_SHAPES,
  BLANK_STATUSES,
  LASER_KINDS,
  LASER_KIND_LABELS,
  MATERIAL_FAMILIES,
  ORIENTATIONS,
  SPEED_UNITS,
  SPEED_UNIT_LABELS,
  TONES,
} from '#shared/schemas/catalog.ts';

/** Words the catalog screens show for the shared enums, and option lists for their selects. */
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const optionsOf = <T extends string>(values: readonly T[], label: (v: T) => string) =>
  values.map((value) => ({ value, label: label(value) }));

export const FAMILY_LABELS = Object.fromEntries(MATERIAL_FAMILIES.map((f) => [f, capital(f)])) as Record<
  (typeof MATERIAL_FAMILIES)[number],
  string
>;
export const TONE_LABELS = { positive: 'Positive (burn is darker)', negative: 'Negative (burn is lighter)' } as const;
export const SHAPE_LABELS = { rectangle: 'Rectangle', 'rounded-rectangle': 'Rounded rectangle', oval: 'Oval', circle: 'Circle' } as const;
export const STATUS_LABELS = { draft: 'Draft', active: 'On sale', archived: 'Archived' } as const;
export const ORIENTATION_LABELS = { portrait: 'Portrait', landscape: 'Landscape', either: 'Either way' } as const;
export const methodLabel = (method: string) => HALFTONE_METHODS[method as HalftoneMethod] ?? method;

export const familyOptions = optionsOf(MATERIAL_FAMILIES, (f) => FAMILY_LABELS[f]);
export const toneOptions = optionsOf(TONES, (t) => TONE_LABELS[t]);
export const laserKindOptions = optionsOf(LASER_KINDS, (k) => LASER_KIND_LABELS[k]);
export const speedUnitOptions = optionsOf(SPEED_UNITS, (u) => SPEED_UNIT_LABELS[u]);
export const shapeOptions = optionsOf(BLANK_SHAPES, (s) => SHAPE_LABELS[s]);
export const statusOptions = optionsOf(BLANK_STATUSES, (s) => STATUS_LABELS[s]);
export const orientationOptions = optionsOf(ORIENTATIONS, (o) => ORIENTATION_LABELS[o]);
export const methodOptions = Object.entries(HALFTONE_METHODS).map(([value, label]) => ({ value, label }));
