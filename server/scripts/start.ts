import { log, run } from './stack/run.ts';
import { onShutdown } from './stack/signals.ts';
import { projectDir, startStack } from './stack/stack.ts';
import { startAppProcess } from './stack/app-process.ts';
import { DEMO_PASSWORD, demoPeople, demoStudios } from '../db/demo-scenario.ts';

/**
 * `npm start`: the whole product on the embedded defaults. Starts the local stack, builds the
 * client, serves client and API from one process, and stops everything on Ctrl-C or SIGTERM.
 */
const port = process.env.PORT ?? '3000';
const stack = await startStack('dev', { appUrl: `http://127.0.0.1:${port}` }).catch((error: Error) => {
  log(`could not start the local stack: ${error.message}`);
  process.exit(1);
});
// Registered before anything else starts, so a Ctrl-C during the build still stops the database.
let stopApp: () => Promise<void> = async () => {};
let shuttingDown = false;
onShutdown(async () => {
  shuttingDown = true;
  await stopApp();
  await stack.stop();
  log('everything stopped');
});

try {
  log('building the client…');
  await run(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], { cwd: projectDir });
  const app = await startAppProcess({ ...stack.env, PORT: port, NODE_ENV: process.env.NODE_ENV ?? 'development' });
  stopApp = app.stop;
  app.child.on('exit', (code) => {
    if (shuttingDown) return;
    log(`the app process stopped (code ${code}); stopping the stack`);
    void stack.stop().finally(() => process.exit(code ?? 1));
  });
  const url = `http://127.0.0.1:${app.port}`;
  console.log(
    [
      '',
      `  Etchwell is running at ${url}`,
      '',
      '  Local services:',
      ...stack.services.map((s) => `    ${s}`),
      '',
      '  Demo studios (storefronts):',
      ...demoStudios.map((s) => `    ${s.name.padEnd(26)} ${url}/s/${s.slug}`),
      '',
      `  Demo sign-ins (${url}/sign-in), password ${DEMO_PASSWORD}:`,
      ...demoPeople
        .filter((p) => p.password)
        .map(
          (p) =>
            `    ${p.email.padEnd(28)} ${p.platformAdmin ? 'platform admin' : p.memberships.map((m) => `${m.role} of ${m.studio}`).join(', ')}`,
        ),
      ...demoPeople
        .filter((p) => !p.password)
        .map((p) => `    ${p.email.padEnd(28)} buyer: sign in by e-mailed link, read it in the mail inbox`),
      '',
      '  Press Ctrl-C to stop everything.',
      '',
    ].join('\n'),
  );
} catch (error) {
  log(`start failed: ${(error as Error).message}`);
  await stopApp();
  await stack.stop();
  process.exit(1);
}
