import { join } from 'node:path';
import { ensureReferenceTools } from './stack/reference-tools.ts';
import { projectDir } from './stack/stack.ts';
import { runImagingBench } from '../../tests/bench/imaging-bench.ts';

/** `npm run bench`: installs the reference programs when missing, then prints the tables. */
await ensureReferenceTools({ imagemagick: true, chromium: true });
await runImagingBench(join(projectDir, '.data', 'reference-photos'));
