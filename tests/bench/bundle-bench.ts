import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { build } from 'vite';

/**
 * What a buyer's browser downloads on the storefront's first load: the scripts the built
 * index.html names (its entry and module preloads), gzipped at level 9 as a server would send
 * them. Lazy pages (designer, cart, workspace) and the HEIC converter are not part of it.
 */
export async function measureStorefrontFirstLoad(
  projectDir: string,
): Promise<{ files: Array<{ name: string; gzipKb: number }>; totalKb: number }> {
  const outDir = join(projectDir, '.data', 'bench-client');
  await build({ root: projectDir, logLevel: 'warn', build: { outDir, emptyOutDir: true } });
  const html = readFileSync(join(outDir, 'index.html'), 'utf8');
  const scripts = [...html.matchAll(/(?:src|href)="(\/assets\/[^"]+\.js)"/g)].map((m) => m[1]!);
  const files = scripts.map((path) => ({
    name: path.replace('/assets/', ''),
    gzipKb: gzipSync(readFileSync(join(outDir, path)), { level: 9 }).length / 1024,
  }));
  return { files, totalKb: files.reduce((sum, f) => sum + f.gzipKb, 0) };
}
