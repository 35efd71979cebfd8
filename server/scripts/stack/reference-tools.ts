import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { log, run } from './run.ts';
import { projectDir } from './stack.ts';

/** Debian packages and files the tests and benchmarks compare against, installed when missing. */
let aptUpdated = false;
async function aptInstall(packages: string[]): Promise<void> {
  if (!aptUpdated) await run('apt-get', ['update'], { quiet: true });
  aptUpdated = true;
  await run('apt-get', ['install', '-y', '--no-install-recommends', ...packages], {
    quiet: true,
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

const pillowInstalled = () =>
  run('/usr/bin/python3', ['-c', 'import PIL'], { quiet: true }).then(
    () => true,
    () => false,
  );

/** What the tests and benchmarks check against: Chromium, Pillow, Poppler, ImageMagick, open-licensed photographs. */
export async function ensureReferenceTools(need: { chromium?: boolean; imagemagick?: boolean } = {}): Promise<void> {
  const missing: string[] = [];
  if (need.chromium && !existsSync('/usr/bin/chromium')) missing.push('chromium');
  if (need.imagemagick && !existsSync('/usr/bin/convert')) missing.push('imagemagick');
  if (!(await pillowInstalled())) missing.push('python3-pil');
  // Poppler's pdftotext and pdftoppm read the job sheets back.
  if (!existsSync('/usr/bin/pdftotext')) missing.push('poppler-utils');
  if (missing.length) {
    log(`installing Debian packages for the tests: ${missing.join(', ')} (a minute or two)…`);
    await aptInstall(missing);
  }
  // The photographs of python3-skimage (NASA public domain and CC0), unpacked without installing
  // the package and its dependencies.
  const photos = join(projectDir, '.data', 'reference-photos');
  const wanted = ['astronaut.png', 'camera.png', 'chelsea.png', 'coffee.png'];
  if (wanted.every((name) => existsSync(join(photos, name)))) return;
  log("fetching reference photographs from Debian's python3-skimage…");
  if (!aptUpdated) await run('apt-get', ['update'], { quiet: true });
  aptUpdated = true;
  const work = mkdtempSync(join(tmpdir(), 'etchwell-skimage-'));
  try {
    await run('apt-get', ['download', 'python3-skimage'], { cwd: work, quiet: true });
    const deb = readdirSync(work).find((f) => f.endsWith('.deb'))!;
    await run('dpkg', ['-x', deb, 'x'], { cwd: work, quiet: true });
    const found = (await run('find', [join(work, 'x'), '-path', '*skimage/data/*.png'], { quiet: true })).split('\n').filter(Boolean);
    mkdirSync(photos, { recursive: true });
    for (const name of wanted) {
      const source = found.find((f) => f.endsWith(`/${name}`));
      if (!source) throw new Error(`python3-skimage has no ${name}`);
      copyFileSync(source, join(photos, name));
    }
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
