import { spawn, type ChildProcess } from 'node:child_process';
import { log } from './stack/run.ts';
import { onShutdown } from './stack/signals.ts';
import { projectDir, startStack } from './stack/stack.ts';
import { startAppProcess, type AppProcess } from './stack/app-process.ts';

/**
 * `npm run dev`: the local stack, the API in watch mode (tsx restarts it on every save) and
 * Vite's dev server with hot reload, which proxies /api to the API (see vite.config.ts).
 */
const apiPort = process.env.API_PORT ?? '3001';
// Pages are served by Vite: links in e-mails and the upload origin use its address.
const stack = await startStack('dev', { appUrl: 'http://127.0.0.1:5173' }).catch((error: Error) => {
  log(`could not start the local stack: ${error.message}`);
  process.exit(1);
});
let api: AppProcess | undefined;
let vite: ChildProcess | undefined;

const stopAll = async () => {
  if (vite && vite.exitCode === null) {
    const exited = new Promise((resolve) => vite!.once('exit', resolve));
    vite.kill('SIGTERM');
    await exited;
  }
  await api?.stop();
  await stack.stop();
  log('everything stopped');
};
onShutdown(stopAll);

try {
  api = await startAppProcess({ ...stack.env, PORT: apiPort, NODE_ENV: 'development' }, { watch: true });
  vite = spawn(process.execPath, ['node_modules/vite/bin/vite.js'], {
    cwd: projectDir,
    stdio: 'inherit',
    env: { ...process.env, API_PORT: apiPort },
    detached: true,
  });
  log(`API in watch mode on http://127.0.0.1:${apiPort}; open the Vite address below (it proxies /api there)`);
} catch (error) {
  log(`dev failed to start: ${(error as Error).message}`);
  await stopAll();
  process.exit(1);
}
