import { readFileSync } from 'node:fs';

/** The version in package.json, shown by /api/health. */
export const appVersion: string = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')).version;
