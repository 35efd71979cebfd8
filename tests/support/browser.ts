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
  newPage(options?: { bypassCSP?: boolean }): Promise<{ page: Page; problems: string[] }>;
};

/**
 * For a browser test file: the built client and the API served by one in-process server on a
 * free port, on a database of its own, and Debian's Chromium driven by playwright-core.
 * `prepare` runs first and may return environment overrides for the app (a fake's address).
 */
export function useBrowser(prepare?: () => Promise<Record<string, string>>, options: { worker?: boolean } = {}): BrowserContext {
  const context = {} as BrowserContext & { server: Server; close(): Promise<void> };
  beforeAll(async () => {
    mkdirSync(screenshotDir, { recursive: true });
    Object.assign(context, await buildTestApp((await prepare?.()) ?? {}, options));
    context.server = createServer(context.app);
    // An APP_URL from `prepare` names the port (links in e-mails and payment returns use it).
    const port = context.env.APP_URL && new URL(context.env.APP_URL).port ? Number(new URL(context.env.APP_URL).port) : 0;
    await new Promise<void>((resolve) => context.server.listen(port, '127.0.0.1', resolve));
    const address = context.server.address();
    context.baseUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
    context.browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: CHROMIUM_ARGS });
    // bypassCSP only for pages that inject a checker (axe-core); the app's own pages keep the CSP.
    context.newPage = async ({ bypassCSP = false } = {}) => {
      const page = await context.browser.newPage({ viewport: { width: 1280, height: 860 }, bypassCSP });
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

/** How many CSS pixels the page reaches past the viewport's width (0: no sideways scrolling). */
export async function sidewaysOverflow(page: Page): Promise<number> {
  return page.evaluate(() => Math.max(0, document.documentElement.scrollWidth - window.innerWidth));
}

/** A port free on loopback now, for an app whose own address must be known before it starts. */
export async function freePort(): Promise<number> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', resolve));
  const address = probe.address();
  await new Promise((resolve) => probe.close(resolve));
  return typeof address === 'object' && address ? address.port : 0;
}

/** Runs axe-core (from npm) in the page; answers the serious and critical violations. */
export async function seriousA11yViolations(page: Page): Promise<string[]> {
  await page.addScriptTag({ path: join(import.meta.dirname, '..', '..', 'node_modules', 'axe-core', 'axe.min.js') });
  const violations = await page.evaluate(async () => {
    const axe = (
      globalThis as unknown as {
        axe: { run(): Promise<{ violations: Array<{ id: string; impact: string; nodes: Array<{ target: string[] }> }> }> };
      }
    ).axe;
    return (await axe.run()).violations;
  });
  return violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}

/** Signs in on the sign-in page with a password, as a person would, and waits for the landing page. */
export async function signInOnPage(page: Page, baseUrl: string, email: string, password: string, landing: string | RegExp): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(landing);
}
