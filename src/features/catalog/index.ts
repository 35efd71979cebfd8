// What other features may use of the catalog: the laser cautions and the halftone method choices.
export { LaserCautions } from './components/laser-cautions.tsx';
export { methodOptions } from './labels.ts';
