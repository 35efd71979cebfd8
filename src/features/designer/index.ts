// What other features may use of the designer: the mock-up worker's job and look, for previews
// drawn elsewhere with the same pipeline.
export type { MockupJob, MockupLook } from './mockup-protocol.ts';
export { PlacedPhoto } from './components/placed-photo.tsx';
