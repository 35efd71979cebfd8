import type { LaserKind, MaterialInput } from '../../../shared/schemas/catalog.ts';
import type { HalftoneMethod } from '../../../shared/imaging/halftone/halftone.ts';

/**
 * The materials every new studio starts with. Colours are for the mock-up (surface, and the
 * colour a burn leaves); tone says whether the photo burns as a negative (the mark is lighter than
 * the surface); densities and suggested methods are trade rules of thumb for CO2 lasers — common
 * practice, no single published source. Owners edit their copies freely.
 */
export type LibraryMaterial = MaterialInput & { suggestedLinesPerInch: number; suggestedHalftone: HalftoneMethod };

const GLASS = 'Glass can crack and chip: handle it with gloves and let it cool before touching. Wear eye protection.';
const STONE = 'Stone dust is harmful to breathe: run fume extraction and wipe the piece with a damp cloth, not compressed air.';
const WOOD = 'Wood can flare: never leave the machine running unattended and keep fire suppression at hand.';
const ACRYLIC = 'Acrylic burns readily and its fumes irritate: run extraction and never leave it unattended.';
const METAL = 'Coated metal gives off fumes from the coating: run extraction. Fibre lasers need eye protection rated for their wavelength.';
const ALL: LaserKind[] = ['co2', 'fibre', 'diode'];
const NOT_CO2_OR_DIODE: LaserKind[] = ['co2', 'diode'];

const base = { safetyNotes: '', forbiddenOn: [] as LaserKind[], forbiddenReason: '' };

export const MATERIAL_LIBRARY: LibraryMaterial[] = [
  // Common practice: painted glass about 300–360 lines per inch, negative, Jarvis–Judice–Ninke.
  { ...base, name: 'Black-backed (painted) glass', family: 'glass', surfaceColour: '#111418', markColour: '#e8e6e1', defaultTone: 'negative', linesPerInchMin: 300, linesPerInchMax: 360, suggestedLinesPerInch: 360, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: GLASS },
  { ...base, name: 'Clear glass', family: 'glass', surfaceColour: '#2b3236', markColour: '#dfe5e4', defaultTone: 'negative', linesPerInchMin: 250, linesPerInchMax: 300, suggestedLinesPerInch: 300, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: GLASS },
  // Common practice: slate 250–330, negative.
  { ...base, name: 'Slate', family: 'stone', surfaceColour: '#3a3f44', markColour: '#b9bcbc', defaultTone: 'negative', linesPerInchMin: 250, linesPerInchMax: 330, suggestedLinesPerInch: 300, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: STONE },
  // Common practice: black granite about 250–260, negative.
  { ...base, name: 'Black granite', family: 'stone', surfaceColour: '#1c1d1f', markColour: '#c9c9c6', defaultTone: 'negative', linesPerInchMin: 250, linesPerInchMax: 260, suggestedLinesPerInch: 254, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: STONE },
  { ...base, name: 'Black marble', family: 'stone', surfaceColour: '#1e1e20', markColour: '#d0cec8', defaultTone: 'negative', linesPerInchMin: 250, linesPerInchMax: 300, suggestedLinesPerInch: 254, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: STONE },
  // Common practice: wood 250–400, burns dark: positive.
  { ...base, name: 'Maple', family: 'wood', surfaceColour: '#e6c99a', markColour: '#5a3a1e', defaultTone: 'positive', linesPerInchMin: 250, linesPerInchMax: 400, suggestedLinesPerInch: 300, suggestedHalftone: 'stucki', safetyNotes: WOOD },
  { ...base, name: 'Walnut', family: 'wood', surfaceColour: '#6b4a30', markColour: '#2a1a10', defaultTone: 'positive', linesPerInchMin: 250, linesPerInchMax: 350, suggestedLinesPerInch: 300, suggestedHalftone: 'stucki', safetyNotes: WOOD },
  { ...base, name: 'Alder', family: 'wood', surfaceColour: '#d9a877', markColour: '#5b3920', defaultTone: 'positive', linesPerInchMin: 250, linesPerInchMax: 400, suggestedLinesPerInch: 300, suggestedHalftone: 'stucki', safetyNotes: WOOD },
  { ...base, name: 'Bamboo', family: 'wood', surfaceColour: '#dcc08a', markColour: '#5e3f1f', defaultTone: 'positive', linesPerInchMin: 250, linesPerInchMax: 350, suggestedLinesPerInch: 300, suggestedHalftone: 'stucki', safetyNotes: WOOD },
  { ...base, name: 'Cork', family: 'cork', surfaceColour: '#c49a6c', markColour: '#4a3320', defaultTone: 'positive', linesPerInchMin: 150, linesPerInchMax: 250, suggestedLinesPerInch: 200, suggestedHalftone: 'floyd-steinberg', safetyNotes: WOOD },
  { ...base, name: 'Genuine leather', family: 'leather', surfaceColour: '#8a5a3a', markColour: '#3a2416', defaultTone: 'positive', linesPerInchMin: 200, linesPerInchMax: 300, suggestedLinesPerInch: 254, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: 'Vegetable-tanned leather only: chrome-tanned and faux leather give off harmful fumes. Run extraction.' },
  // Common practice: anodised aluminium 300–600, negative.
  { ...base, name: 'Black anodised aluminium', family: 'metal', surfaceColour: '#202124', markColour: '#e6e6e6', defaultTone: 'negative', linesPerInchMin: 300, linesPerInchMax: 600, suggestedLinesPerInch: 500, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: METAL },
  { ...base, name: 'Powder-coated stainless (tumblers)', family: 'metal', surfaceColour: '#2d3a4a', markColour: '#c8ccd0', defaultTone: 'negative', linesPerInchMin: 300, linesPerInchMax: 500, suggestedLinesPerInch: 400, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: METAL },
  { ...base, name: 'Cast acrylic', family: 'acrylic', surfaceColour: '#26343b', markColour: '#e5ecec', defaultTone: 'negative', linesPerInchMin: 300, linesPerInchMax: 500, suggestedLinesPerInch: 400, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: ACRYLIC },
  { ...base, name: 'Mirror acrylic', family: 'acrylic', surfaceColour: '#b9bfc4', markColour: '#2a2d30', defaultTone: 'positive', linesPerInchMin: 300, linesPerInchMax: 400, suggestedLinesPerInch: 350, suggestedHalftone: 'jarvis-judice-ninke', safetyNotes: `${ACRYLIC} Engrave the mirrored back, not the face.` },
  // Never on these lasers (university and makerspace prohibited-material lists; common practice).
  { ...base, name: 'PVC and vinyl', family: 'plastic', surfaceColour: '#dddddd', markColour: '#777777', defaultTone: 'positive', linesPerInchMin: 100, linesPerInchMax: 1200, suggestedLinesPerInch: 254, suggestedHalftone: 'floyd-steinberg', forbiddenOn: ALL, forbiddenReason: 'Releases chlorine and hydrochloric acid: harmful to people and it corrodes the machine.' },
  { ...base, name: 'Faux leather', family: 'plastic', surfaceColour: '#5a4034', markColour: '#2c1f19', defaultTone: 'positive', linesPerInchMin: 100, linesPerInchMax: 1200, suggestedLinesPerInch: 254, suggestedHalftone: 'floyd-steinberg', forbiddenOn: ALL, forbiddenReason: 'Usually PVC: releases chlorine gas.' },
  { ...base, name: 'PTFE (Teflon)', family: 'plastic', surfaceColour: '#f2f2f2', markColour: '#999999', defaultTone: 'positive', linesPerInchMin: 100, linesPerInchMax: 1200, suggestedLinesPerInch: 254, suggestedHalftone: 'floyd-steinberg', forbiddenOn: ALL, forbiddenReason: 'Releases toxic fluorine compounds.' },
  { ...base, name: 'ABS', family: 'plastic', surfaceColour: '#e8e2d0', markColour: '#6d5f45', defaultTone: 'positive', linesPerInchMin: 100, linesPerInchMax: 1200, suggestedLinesPerInch: 254, suggestedHalftone: 'floyd-steinberg', forbiddenOn: NOT_CO2_OR_DIODE, forbiddenReason: 'Releases hydrogen cyanide and melts into a sticky mess.' },
  { ...base, name: 'Polycarbonate', family: 'plastic', surfaceColour: '#d6dde0', markColour: '#6f6a5d', defaultTone: 'positive', linesPerInchMin: 100, linesPerInchMax: 1200, suggestedLinesPerInch: 254, suggestedHalftone: 'floyd-steinberg', forbiddenOn: NOT_CO2_OR_DIODE, forbiddenReason: 'Catches fire and discolours; the fumes are harmful.' },
  { ...base, name: 'Fibreglass', family: 'composite', surfaceColour: '#d9d4c4', markColour: '#7d745c', defaultTone: 'positive', linesPerInchMin: 100, linesPerInchMax: 1200, suggestedLinesPerInch: 254, suggestedHalftone: 'floyd-steinberg', forbiddenOn: NOT_CO2_OR_DIODE, forbiddenReason: 'The resin gives off toxic fumes; the glass fibres do not cut.' },
  { ...base, name: 'Carbon fibre', family: 'composite', surfaceColour: '#1f1f1f', markColour: '#5a5a5a', defaultTone: 'positive', linesPerInchMin: 100, linesPerInchMax: 1200, suggestedLinesPerInch: 254, suggestedHalftone: 'floyd-steinberg', forbiddenOn: NOT_CO2_OR_DIODE, forbiddenReason: 'The resin gives off toxic fumes and the fibres can ignite.' },
];

/** The example recipe from trade practice: painted glass on a 100 W CO2 machine, speed 5, power 10–14.5 %. */
export const EXAMPLE_GLASS_RECIPE = { linesPerInch: 360, halftoneMethod: 'jarvis-judice-ninke' as const, tone: 'negative' as const, speed: 5, powerMinPercent: 10, powerMaxPercent: 14.5, passes: 1 };
