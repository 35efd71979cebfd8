import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { log, run, runAttached } from './stack/run.ts';
import { onShutdown } from './stack/signals.ts';
import { projectDir, startStack } from './stack/stack.ts';

/**
 * `npm test`: typecheck, then the test stack (its own PostgreSQL cluster and ports, beside any
 * running `npm start`), the client build the browser tests load, Debian's Chromium when missing,
 * and vitest over the unit, integration and browser projects. Everything started is stopped,
 * also after a failure; the exit code is the first failure's.
 */
const node = process.execPath;
const bin = (name: string) => `node_modules/${name}`;

let aptUpdated = false;
async function aptInstall(packages: string[]): Promise<void> {
  if (!aptUpdated) await run('apt-get', ['update'], { quiet: true });
  aptUpdated = true;
  await run('apt-get', ['install', '-y', '--no-install-recommends', ...packages], { quiet: true, env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
}

const pillowInstalled = () => run('/usr/bin/python3', ['-c', 'import PIL'], { quiet: true }).then(() => true, () => false);

/** What the tests check against: Chromium, Pillow, and open-licensed photographs. */
async function ensureReferenceTools(): Promise<void> {
  const missing: string[] = [];
  if (!existsSync('/usr/bin/chromium')) missing.push('chromium');
  if (!(await pillowInstalled())) missing.push('python3-pil');
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

log('typecheck: server, shared, client, browser tests');
for (const project of ['tsconfig.json', 'shared', 'src', 'tests/browser']) {
  const code = await runAttached(node, [bin('typescript/bin/tsc'), '-p', project], { cwd: projectDir });
  if (code !== 0) {
    log(`typecheck of ${project} failed`);
    process.exit(code);
  }
}

const stack = await startStack('test').catch((error: Error) => {
  log(`could not start the test stack: ${error.message}`);
  process.exit(1);
});
onShutdown(() => stack.stop());

let code = 1;
try {
  await Promise.all([
    ensureReferenceTools(),
    (async () => {
      log('building the client for the browser tests…');
      await run(node, [bin('vite/bin/vite.js'), 'build', '--logLevel', 'warn'], { cwd: projectDir });
    })(),
  ]);
  code = await runAttached(node, [bin('vitest/vitest.mjs'), 'run', '--reporter=verbose', ...process.argv.slice(2)], {
    cwd: projectDir,
    env: { ...process.env, ...stack.env, TEST_DATABASE_TEMPLATE_URL: stack.env.DATABASE_URL!, CHROMIUM_PATH: '/usr/bin/chromium' },
  });
} catch (error) {
  log(`test run failed before the tests: ${(error as Error).message}`);
} finally {
  await stack.stop();
}
process.exit(code);
