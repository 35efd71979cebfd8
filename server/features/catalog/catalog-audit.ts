import { HALFTONE_METHODS, type HalftoneMethod } from '../../../shared/imaging/halftone/halftone.ts';
import { formatMoney } from '../../../shared/money.ts';
import type { BlankSize, Recipe } from './catalog.entity.ts';

/**
 * How catalog changes read in the audit log: a recipe's burn settings and a size's price, as
 * labelled facts that can be listed or compared.
 */
export function recipeFacts(recipe: Recipe): Record<string, string> {
  const unit = recipe.machine.speedUnit === 'percent' ? ' %' : ` ${recipe.machine.speedUnit}`;
  return {
    'Line density': `${recipe.linesPerInch} lpi`,
    Halftone: HALFTONE_METHODS[recipe.halftoneMethod as HalftoneMethod] ?? recipe.halftoneMethod,
    Tone: recipe.tone,
    Speed: `${recipe.speed}${unit}`,
    Power: `${recipe.powerMinPercent}–${recipe.powerMaxPercent} %`,
    Passes: String(recipe.passes),
  };
}

export const recipeSubject = (recipe: Recipe) => `${recipe.material.name} on ${recipe.machine.name}`;

export const sizeSubject = (size: BlankSize) => `${size.blank.name}, ${size.label}`;

export const sizePrice = (size: BlankSize, currency: string) => formatMoney(size.priceMinor, currency);
