import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { screenshotDir, useBrowser } from '../support/browser.ts';
import { useMailFake } from '../support/mail.ts';

describe('opening a studio and signing in by e-mailed link, in Chromium', () => {
  const mail = useMailFake();
  const b = useBrowser(async () => {
    await mail.start();
    return { SMTP_URL: mail.smtpUrl };
  });
  const latestTo = (email: string) => mail.latestTo(email);

  it('opens a studio with a live address check and lands in its workspace', async () => {
    const { page, problems } = await b.newPage();
    await page.goto(`${b.baseUrl}/open-a-studio`);
    await page.getByLabel('Studio name').fill('Quill & Cinder Studio');
    await expect.poll(() => page.getByLabel('Storefront address').inputValue()).toBe('quill-cinder-studio');
    await expect.poll(() => page.getByText('Available: your storefront will be at /s/quill-cinder-studio').count()).toBe(1);
    await page.getByLabel('Your name').fill('Wren Halloway');
    await page.getByLabel('Your e-mail address').fill('wren@quill-cinder.test');
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Open the studio' }).click();
    await expect.poll(() => page.getByText('Use at least 10 characters.').count()).toBe(1);
    await page.screenshot({ path: join(screenshotDir, 'open-a-studio.png'), fullPage: true });
    await page.getByLabel('Password').fill('a long enough password');
    await page.getByRole('button', { name: 'Open the studio' }).click();
    await page.waitForURL(`${b.baseUrl}/studio/quill-cinder-studio`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Quill & Cinder Studio');
    expect((await latestTo('wren@quill-cinder.test')).subject).toBe('Confirm your e-mail address for Quill & Cinder Studio');
    expect(problems).toEqual([]);
  });

  it('signs a buyer in with an e-mailed link', async () => {
    const { page, problems } = await b.newPage();
    await page.goto(`${b.baseUrl}/sign-in`);
    await page.getByRole('tab', { name: 'With an e-mailed link' }).click();
    await page.getByLabel('E-mail address').fill('buyer@example.com');
    await page.getByRole('button', { name: 'E-mail me a link' }).click();
    await page.waitForURL(/\/sign-in\/link-sent/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Check your inbox');
    const message = await latestTo('buyer@example.com');
    const link = new URL(message.links.find((l) => l.includes('/api/auth/callback/nodemailer'))!);
    await page.goto(`${b.baseUrl}${link.pathname}${link.search}`);
    await page.waitForURL(`${b.baseUrl}/`);
    await expect.poll(() => page.getByRole('button', { name: 'Sign out' }).count()).toBe(1);
    expect(problems).toEqual([]);
  });
});
