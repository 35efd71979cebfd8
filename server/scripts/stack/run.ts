import { spawn, type SpawnOptions } from 'node:child_process';

/** Runs a command to completion; rejects with its output when it fails. */
export function run(command: string, args: string[], options: SpawnOptions & { quiet?: boolean } = {}): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { ...options, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout?.on('data', (chunk: Buffer) => {
      output += chunk;
      if (!options.quiet) process.stdout.write(chunk);
    });
    child.stderr?.on('data', (chunk: Buffer) => {
      output += chunk;
      if (!options.quiet) process.stderr.write(chunk);
    });
    child.on('error', reject);
    child.on('close', (code) => {
      if (code === 0) resolve(output);
      else reject(new Error(`${command} ${args.join(' ')} exited with ${code}\n${output.slice(-4000)}`));
    });
  });
}

/** Runs a command with the terminal attached; resolves with its exit code. */
export function runAttached(command: string, args: string[], options: SpawnOptions = {}): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', ...options });
    child.on('error', reject);
    child.on('close', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

export function log(message: string): void {
  console.log(`[stack] ${message}`);
}
