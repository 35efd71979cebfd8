import { mkdirSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { join } from 'node:path';
import { afterAll, beforeAll } from 'vitest';
import { chromium, type Browser, type Page } from 'playwright-core';
import { buildTestApp, type TestApp } from './test-app.ts';

export const screenshotDir = join(import.meta.dirname, '..', '..', 'test-results', 'screenshots');

/** Flags for Debian's Chromium on a machine with no outside network and no GPU. */
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export type BrowserContext = TestApp & {
  baseUrl: string;
  browser: Browser;
  /** A new page that records console errors and failed requests in `problems`. */
  newPage(): Promise<{ page: Page; problems: string[] }>;
};

/**
 * For a browser test file: the built client and the API served by one in-process server on a
 * free port, on a database of its own, and Debian's Chromium driven by playwright-core.
 * `prepare` runs first and may return environment overrides for the app (a fake's address).
 */
export function useBrowser(prepare?: () => Promise<Record<string, string>>): BrowserContext {
  const context = {} as BrowserContext & { server: Server; close(): Promise<void> };
  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    Object.assign(context, await buildTestApp((await prepare?.()) ?? {}));
    context.server = createServer(context.app);
    await new Promise<void>((resolve) => context.server.listen(0, '127.0.0.1', resolve));
    const address = context.server.address();
    context.baseUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
    context.browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: CHROMIUM_ARGS });
    context.newPage = async () => {
      const page = await context.browser.newPage({ viewport: { width: 1280, height: 860 } });
      const problems: string[] = [];
      page.on('console', (message) => {
        if (message.type() === 'error') problems.push(`console: ${message.text()}`);
      });
      page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
      return { page, problems };
    };
  });
  afterAll(async () => {
    await context.browser?.close();
    await new Promise((resolve) => context.server?.close(resolve));
    await context.close?.();
  });
  return context;
}
