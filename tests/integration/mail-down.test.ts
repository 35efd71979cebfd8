import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxEmail } from '#server/features/outbox/outbox-email.entity.ts';
import { queueEmail } from '#server/features/outbox/outbox.service.ts';
import { eventually } from '../support/fakes.ts';
import { useMailFake } from '../support/mail.ts';
import { startTcpProxy } from '../support/tcp-proxy.ts';
import { buildTestApp } from '../support/test-app.ts';

/**
 * The mail server goes away: e-mails wait in the outbox with the reason, and every one of them
 * arrives, once, when it is back.
 */
describe('mail server down', () => {
  const mail = useMailFake();
  let proxy: Awaited<ReturnType<typeof startTcpProxy>>;
  let t: Awaited<ReturnType<typeof buildTestApp>>;

  beforeAll(async () => {
    await mail.start();
    const smtp = new URL(mail.smtpUrl);
    proxy = await startTcpProxy({ host: smtp.hostname, port: Number(smtp.port) });
    t = await buildTestApp({ SMTP_URL: `smtp://127.0.0.1:${proxy.port}`, OUTBOX_RETRY_SECONDS: '1' });
  });
  afterAll(async () => {
    await proxy?.restore();
    await t?.close();
    proxy?.close();
  });

  it('keeps the e-mails while it is down and delivers each once it is back', async () => {
    await proxy.cut();
    const em = t.orm.em.fork();
    const subjects = Array.from({ length: 5 }, (_, i) => `Outbox check ${i + 1}`);
    for (const subject of subjects) queueEmail(em, { to: 'fern@buyers.test', subject, text: `This is ${subject.toLowerCase()}.` });
    await em.flush();

    // Tried, refused, kept with the reason and a time to try again.
    const waiting = await eventually(async () => {
      const rows = await t.orm.em.fork().find(OutboxEmail, { to: 'fern@buyers.test' });
      return rows.length === 5 && rows.every((r) => r.attempts >= 1 && r.status === 'pending' && r.lastError) ? rows : undefined;
    });
    expect(waiting.every((r) => r.nextAttemptAt.getTime() > r.updatedAt.getTime() - 1000)).toBe(true);

    await proxy.restore();
    await eventually(async () => {
      const rows = await t.orm.em.fork().find(OutboxEmail, { to: 'fern@buyers.test' });
      return rows.every((r) => r.status === 'sent') ? rows : undefined;
    }, 30_000);
    const inbox = (await (await fetch(`${mail.url}/api/messages?to=fern@buyers.test`)).json()) as
      { messages?: Array<{ subject: string }> } | Array<{ subject: string }>;
    const received = (Array.isArray(inbox) ? inbox : (inbox.messages ?? [])).map((m) => m.subject).sort();
    expect(received).toEqual([...subjects].sort());
  });
});
