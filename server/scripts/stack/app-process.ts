import { fork, type ChildProcess } from 'node:child_process';
import { resolve } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { projectDir } from './stack.ts';

export type AppProcess = { port: number; child: ChildProcess; stop(): Promise<void> };

/**
 * Starts server/index.ts in its own process (in watch mode for `npm run dev`) on `env.PORT` and
 * resolves once it answers HTTP. Readiness is asked over HTTP because the watch wrapper runs the
 * server one process further down, out of reach of IPC.
 */
export async function startAppProcess(env: Record<string, string> & { PORT: string }, { watch = false } = {}): Promise<AppProcess> {
  const entry = resolve(projectDir, 'server/index.ts');
  const options = { env: { ...process.env, ...env }, cwd: projectDir, detached: true };
  const child = watch
    ? fork(resolve(projectDir, 'node_modules/tsx/dist/cli.mjs'), ['watch', '--clear-screen=false', entry], options)
    : fork(entry, [], { ...options, execArgv: ['--import', 'tsx'] });
  const stop = () =>
    new Promise<void>((done) => {
      if (child.exitCode !== null || child.signalCode !== null) return done();
      child.once('exit', () => done());
      child.kill('SIGTERM');
      setTimeout(() => child.kill('SIGKILL'), 5000).unref();
    });

  const port = Number(env.PORT);
  for (let attempt = 0; attempt < 300; attempt++) {
    if (child.exitCode !== null) throw new Error(`the app process exited with code ${child.exitCode} before it listened`);
    const answered = await fetch(`http://127.0.0.1:${port}/api/health`).then(
      () => true,
      () => false,
    );
    if (answered) return { port, child, stop };
    await sleep(100);
  }
  await stop();
  throw new Error(`the app did not answer on port ${port} within 30 s`);
}
