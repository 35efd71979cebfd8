import { HALFTONE_METHODS, type HalftoneMethod } from '#shared/imaging/halftone/halftone.ts';
import { SPEED_UNIT_LABELS } from '#shared/schemas/catalog.ts';
import type { BlankSize, Recipe } from './catalog.entity.ts';

/**
 * How catalog changes read in the audit log: a recipe's burn settings as
 * labelled facts that can be listed or compared, and the names they go by.
 */
export function recipeFacts(recipe: Recipe): Record<string, string> {
  return {
    'Line density': `${recipe.linesPerInch} lpi`,
    Halftone: HALFTONE_METHODS[recipe.halftoneMethod as HalftoneMethod] ?? recipe.halftoneMethod,
    Tone: recipe.tone,
    Speed: `${recipe.speed} ${SPEED_UNIT_LABELS[recipe.machine.speedUnit]}`,
    Power: `${recipe.powerMinPercent}–${recipe.powerMaxPercent} %`,
    Passes: String(recipe.passes),
  };
}

export const recipeSubject = (recipe: Recipe) => `${recipe.material.name} on ${recipe.machine.name}`;

export const sizeSubject = (size: BlankSize) => `${size.blank.name}, ${size.label}`;
