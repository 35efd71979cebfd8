import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailFake, type MailFake } from '#fakes/mail/server.ts';
import type { StoredMessage } from '#fakes/mail/mailbox.ts';
import { createMailer } from '#server/adapters/mailer.ts';
import { loadEnv } from '#server/env.ts';
import { settle, temporaryDataDir } from '#tests/support/fakes.ts';

// SMTP per RFC 5321, messages per RFC 5322 / MIME (RFC 2045–2049), sent with nodemailer and
// parsed back with mailparser.
describe('mail stand-in, through nodemailer', () => {
  const data = temporaryDataDir('mail');
  let fake: MailFake;
  const start = (smtpPort = 0, httpPort = 0) => startMailFake({ smtpPort, httpPort, dataDir: data.dir });
  const mailer = () => createMailer(loadEnv({ SMTP_URL: fake.smtpUrl, MAIL_FROM: 'Harbour Light <orders@harbour-light.test>' }));
  const api = async <T>(path: string, init?: RequestInit): Promise<T> => (await fetch(`${fake.url}${path}`, init)).json() as Promise<T>;

  beforeAll(async () => {
    fake = await start();
  });
  afterAll(async () => {
    await fake.stop();
    data.remove();
  });

  it('receives an HTML + text message and returns it parsed, links included', async () => {
    const m = mailer();
    await m.send({
      to: 'ada@example.com',
      subject: 'Your proof is ready',
      text: 'See your proof: http://127.0.0.1:3000/orders/abc?token=t1',
      html: '<p>See <a href="http://127.0.0.1:3000/orders/abc?token=t1&amp;view=proof">your proof</a>.</p>',
    });
    m.close();
    const latest = await api<StoredMessage>('/api/messages/latest?to=ada@example.com');
    expect(latest).toMatchObject({
      subject: 'Your proof is ready',
      to: ['ada@example.com'],
      from: '"Harbour Light" <orders@harbour-light.test>',
      text: 'See your proof: http://127.0.0.1:3000/orders/abc?token=t1',
    });
    expect(latest.html).toContain('<a href="http://127.0.0.1:3000/orders/abc?token=t1&amp;view=proof">');
    expect(latest.links).toEqual(['http://127.0.0.1:3000/orders/abc?token=t1&view=proof', 'http://127.0.0.1:3000/orders/abc?token=t1']);
  });

  it('lists by recipient, newest first, case-insensitively', async () => {
    const m = mailer();
    await m.send({ to: 'bo@example.com', subject: 'first', text: '1' });
    await m.send({ to: 'Bo@Example.com', subject: 'second', text: '2' });
    await m.send({ to: 'cy@example.com', subject: 'other', text: '3' });
    m.close();
    const { messages } = await api<{ messages: StoredMessage[] }>('/api/messages?to=bo@example.com');
    expect(messages.map((x) => x.subject)).toEqual(['second', 'first']);
    expect((await fetch(`${fake.url}/api/messages/latest?to=nobody@example.com`)).status).toBe(404);
  });

  it('shows the inbox and each message as pages a person can read', async () => {
    const inbox = await (await fetch(`${fake.url}/`)).text();
    expect(inbox).toContain('Your proof is ready');
    const latest = await api<StoredMessage>('/api/messages/latest?to=ada@example.com');
    const page = await (await fetch(`${fake.url}/messages/${latest.id}`)).text();
    expect(page).toContain('<iframe');
    expect(page).toContain('sandbox=');
    const text = await (await fetch(`${fake.url}/messages/${latest.id}?view=text`)).text();
    expect(text).toContain('See your proof: http://127.0.0.1:3000/orders/abc?token=t1');
  });

  it('keeps messages across a restart, and clears on request', async () => {
    const { smtpPort, httpPort } = fake;
    await fake.stop();
    await settle();
    fake = await start(smtpPort, httpPort);
    expect((await api<{ messages: StoredMessage[] }>('/api/messages')).messages.length).toBe(4);
    expect(await api('/api/messages', { method: 'DELETE' })).toEqual({ deleted: 4 });
    expect((await api<{ messages: StoredMessage[] }>('/api/messages')).messages).toEqual([]);
  });
});
