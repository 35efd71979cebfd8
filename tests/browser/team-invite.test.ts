import { join } from 'node:path';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '#server/db/seed.ts';
import { DEMO_PASSWORD } from '#server/db/demo-scenario.ts';
import { screenshotDir, useBrowser } from '../support/browser.ts';
import { useMailFake } from '../support/mail.ts';

describe('an owner invites a colleague, who joins from the e-mailed link', () => {
  const mail = useMailFake();
  // The app sends mail to a catcher started before it; its address is known only then.
  const b = useBrowser(async () => {
    await mail.start();
    return { SMTP_URL: mail.smtpUrl };
  });

  beforeAll(async () => {
    await seedDemo(b.orm.em.fork());
  });

  it('owner signs in with a password, invites; the new colleague joins and sees no owner-only pages', async () => {
    const owner = await b.newPage();
    await owner.page.goto(`${b.baseUrl}/sign-in`);
    await owner.page.getByLabel('E-mail address').fill('maren@harbour-light.test');
    await owner.page.getByLabel('Password').fill(DEMO_PASSWORD);
    await owner.page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await owner.page.waitForURL(`${b.baseUrl}/studio/harbour-light`);
    await owner.page.getByRole('link', { name: 'Team' }).click();
    await owner.page.getByLabel('E-mail address').fill('ola@harbour-light.test');
    await owner.page.getByRole('button', { name: 'Send invitation' }).click();
    await expect.poll(() => owner.page.getByRole('cell', { name: 'ola@harbour-light.test' }).count()).toBe(1);
    await owner.page.screenshot({ path: join(screenshotDir, 'team-invited.png'), fullPage: true });
    // The owner also has the settings page: a new storefront colour shows on the storefront.
    await owner.page.getByRole('link', { name: 'Settings' }).click();
    await owner.page.getByLabel('Storefront colour', { exact: true }).fill('#2a7a50');
    await owner.page.getByRole('button', { name: 'Save settings' }).click();
    await expect.poll(() => owner.page.getByText('Settings saved.').count()).toBe(1);
    const logo = await sharp({ create: { width: 300, height: 120, channels: 4, background: { r: 31, g: 111, b: 139, alpha: 1 } } })
      .png()
      .toBuffer();
    await owner.page.getByLabel('Choose a logo').setInputFiles({ name: 'logo.png', mimeType: 'image/png', buffer: logo });
    await expect.poll(() => owner.page.getByText('Logo saved: it shows on the storefront.').count()).toBe(1);
    await owner.page.screenshot({ path: join(screenshotDir, 'settings.png'), fullPage: true });
    await owner.page.goto(`${b.baseUrl}/s/harbour-light`);
    await expect
      .poll(() => owner.page.locator('header img').evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth))
      .toBe(300);
    await expect
      .poll(() => owner.page.evaluate(() => getComputedStyle(document.querySelector('header')!).borderBottomColor))
      .toBe('rgb(42, 122, 80)');
    expect(owner.problems).toEqual([]);

    const invite = await mail.latestTo('ola@harbour-light.test');
    expect(invite.subject).toBe('Join Harbour Light Engraving on Etchwell');
    const link = new URL(invite.links.find((l) => l.includes('/invites/'))!);

    const colleague = await b.newPage();
    await colleague.page.goto(`${b.baseUrl}${link.pathname}`);
    await colleague.page.getByLabel('Your name').fill('Ola Brandt');
    await colleague.page.getByLabel('Choose a password').fill('a new long password');
    await colleague.page.screenshot({ path: join(screenshotDir, 'invite-accept.png'), fullPage: true });
    await colleague.page.getByRole('button', { name: 'Create my account and join' }).click();
    await colleague.page.waitForURL(`${b.baseUrl}/studio/harbour-light`);
    await expect.poll(() => colleague.page.getByRole('heading', { level: 1 }).textContent()).toBe('Harbour Light Engraving');
    const workspaceNav = colleague.page.getByRole('navigation', { name: 'Workspace' });
    expect(await workspaceNav.getByRole('link', { name: 'Overview' }).count()).toBe(1);
    expect(await workspaceNav.getByRole('link', { name: 'Team' }).count()).toBe(0);
    expect(await workspaceNav.getByRole('link', { name: 'Settings' }).count()).toBe(0);
    await colleague.page.screenshot({ path: join(screenshotDir, 'workspace-staff.png'), fullPage: true });
    // Typing the owner-only address by hand shows a refusal, not the page.
    await colleague.page.goto(`${b.baseUrl}/studio/harbour-light/team`);
    await expect.poll(() => colleague.page.getByText('Owners only').count()).toBe(1);
    expect(colleague.problems).toEqual([]);
  });
});
