import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** A temporary folder for one fake's data, removed by the returned function. */
export function temporaryDataDir(name: string): { dir: string; remove(): void } {
  const dir = mkdtempSync(join(tmpdir(), `etchwell-${name}-`));
  return { dir, remove: () => rmSync(dir, { recursive: true, force: true }) };
}

/** Polls until `check` returns a value (not undefined), or fails after `timeoutMs`. */
export async function eventually<T>(check: () => T | undefined | Promise<T | undefined>, timeoutMs = 5000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`condition not met within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

/**
 * After a fake stops, lets this process's HTTP client notice its pooled connections were closed,
 * so the next request opens a new one instead of writing to a dead socket.
 */
export const settle = () => new Promise((resolve) => setTimeout(resolve, 50));
