import sharp from 'sharp';
import { errorDiffuse } from './shared/imaging/halftone/error-diffusion.ts';
const raw = await sharp('.data/reference-photos/astronaut.png').resize(2880, 3600, { fit: 'fill' }).greyscale().raw().toBuffer();
const img = { width: 2880, height: 3600, data: Float32Array.from(raw) };
for (const k of ['floyd-steinberg', 'jarvis-judice-ninke', 'stucki'] as const) { errorDiffuse(img, { kernel: k }); const ts = []; for (let r = 0; r < 3; r++) { const t = performance.now(); errorDiffuse(img, { kernel: k }); ts.push(performance.now() - t); } ts.sort(); console.log(k, (10.368 / (ts[1]! / 1000)).toFixed(0), 'MP/s'); }
