// The entry of `npm start`, `npm test` and `npm run dev`. Plain JavaScript on purpose: on a fresh
// clone nothing is installed yet, so it first runs `npm ci` when node_modules is missing or older
// than the lock file, then hands over to the TypeScript script named on the command line.
import { existsSync, statSync } from 'node:fs';
import { spawn, spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const installed = join(root, 'node_modules', '.package-lock.json');
const lock = join(root, 'package-lock.json');
if (!existsSync(installed) || statSync(installed).mtimeMs < statSync(lock).mtimeMs) {
  console.log('[stack] installing dependencies (npm ci)…');
  const result = spawnSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

const [script, ...args] = process.argv.slice(2);
const child = spawn(process.execPath, ['--import', 'tsx', join(root, 'server', 'scripts', `${script}.ts`), ...args], {
  cwd: root,
  stdio: 'inherit',
  // The pinned S3 SDK runs on Node 20 and says so on every start; the upgrade is tracked in
  // DEVELOPERS.md, the warning adds nothing to each run.
  env: { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true', ...process.env },
});
// Pass stop signals on and wait: the script stops what it started (the database too) and
// exits on its own. A Ctrl-C reaches the script directly as well; it ignores the repeat.
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => child.kill(signal));
}
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
