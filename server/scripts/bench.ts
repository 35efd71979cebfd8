import { join } from 'node:path';
import { ensureReferenceTools } from './stack/reference-tools.ts';
import { projectDir } from './stack/stack.ts';
import { runImagingBench } from '#tests/bench/imaging-bench.ts';
import { measureStorefrontFirstLoad } from '#tests/bench/bundle-bench.ts';

/** `npm run bench`: installs the reference programs when missing, then prints the tables. */
await ensureReferenceTools({ imagemagick: true, chromium: true });
await runImagingBench(join(projectDir, '.data', 'reference-photos'));

const bundle = await measureStorefrontFirstLoad(projectDir);
console.log('\nStorefront first load (gzipped JavaScript named by index.html; target ≤ 150 KB)');
for (const file of bundle.files) console.log(`  ${file.name.padEnd(40)} ${file.gzipKb.toFixed(1).padStart(7)} KB`);
console.log(`  ${'total'.padEnd(40)} ${bundle.totalKb.toFixed(1).padStart(7)} KB`);
