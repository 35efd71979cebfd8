import { fork, type ChildProcess } from 'node:child_process';
import { resolve } from 'node:path';
import { projectDir } from './stack.ts';

export type AppProcess = { port: number; child: ChildProcess; stop(): Promise<void> };

/** Starts server/index.ts in its own process and resolves once it listens. */
export function startAppProcess(env: Record<string, string>, { watch = false } = {}): Promise<AppProcess> {
  return new Promise((resolvePromise, reject) => {
    const entry = resolve(projectDir, 'server/index.ts');
    const child = watch
      ? fork(resolve(projectDir, 'node_modules/tsx/dist/cli.mjs'), ['watch', '--clear-screen=false', entry], { env: { ...process.env, ...env }, cwd: projectDir, detached: true })
      : fork(entry, [], { env: { ...process.env, ...env }, cwd: projectDir, execArgv: ['--import', 'tsx'], detached: true });
    const stop = () =>
      new Promise<void>((done) => {
        if (child.exitCode !== null || child.signalCode !== null) return done();
        child.once('exit', () => done());
        child.kill('SIGTERM');
        setTimeout(() => child.kill('SIGKILL'), 5000).unref();
      });
    child.once('exit', (code) => reject(new Error(`the app process exited with code ${code} before it listened`)));
    child.on('message', (message: { type?: string; port?: number }) => {
      if (message?.type === 'listening' && message.port) resolvePromise({ port: message.port, child, stop });
    });
  });
}
