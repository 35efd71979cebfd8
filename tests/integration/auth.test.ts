import { describe, expect, it } from 'vitest';
import request from 'supertest';
import type { StoredMessage } from '#fakes/mail/mailbox.ts';
import { User } from '#server/features/accounts/user.entity.ts';
import { buildTestApp, useTestApp } from '../support/test-app.ts';
import { useMailFake } from '../support/mail.ts';
import { createUser, signIn, TEST_PASSWORD } from '../support/factories.ts';

describe('sign-in', () => {
  const mail = useMailFake();
  const t = useTestApp(async () => ({ SMTP_URL: (await mail.start()).smtpUrl }));

  const latestMailTo = (email: string) => mail.latestTo(email);
  const me = async (agent: ReturnType<typeof request.agent>) => (await agent.get('/api/me').expect(200)).body;

  async function requestLink(agent: ReturnType<typeof request.agent>, email: string) {
    const csrf = await agent.get('/api/auth/csrf').expect(200);
    return agent
      .post('/api/auth/signin/nodemailer')
      .set('x-auth-return-redirect', '1')
      .type('form')
      .send({ csrfToken: csrf.body.csrfToken, email, callbackUrl: '/' });
  }
  /** The link's path and query: the mail says APP_URL, the test talks to the app directly. */
  const linkPath = (message: StoredMessage) => {
    const url = new URL(message.links.find((l) => l.includes('/api/auth/callback/nodemailer'))!);
    return `${url.pathname}${url.search}`;
  };

  describe('by e-mailed link', () => {
    it('sends a link that signs a new buyer in, once', async () => {
      const agent = request.agent(t.app);
      const sent = await requestLink(agent, 'New.Buyer@Example.com');
      expect(sent.status).toBe(200);
      expect(sent.body.url).toContain('/api/auth/verify-request');
      const message = await latestMailTo('new.buyer@example.com');
      expect(message.subject).toBe('Your Etchwell sign-in link');

      const opened = await agent.get(linkPath(message));
      expect(opened.status).toBe(302);
      const cookie = String(opened.headers['set-cookie']);
      expect(cookie).toMatch(/authjs\.session-token=[^;]+;.*HttpOnly/i);
      expect(cookie).toMatch(/SameSite=Lax/i);
      expect((await me(agent)).user).toMatchObject({ email: 'new.buyer@example.com', emailVerified: true, isPlatformAdmin: false });

      // The same link a second time: refused, no session.
      const other = request.agent(t.app);
      const reused = await other.get(linkPath(message));
      expect(reused.headers.location).toContain('error=Verification');
      expect((await me(other)).user).toBeNull();
    });

    it('refuses an expired link', async () => {
      const agent = request.agent(t.app);
      await requestLink(agent, 'late@example.com');
      const message = await latestMailTo('late@example.com');
      await t.orm.em
        .fork()
        .getConnection()
        .execute("update verification_token set expires = now() - interval '1 minute' where identifier = 'late@example.com'");
      const opened = await agent.get(linkPath(message));
      expect(opened.headers.location).toContain('error=Verification');
      expect((await me(agent)).user).toBeNull();
    });

    it('asks for a valid address before sending anything', async () => {
      const res = await requestLink(request.agent(t.app), 'not-an-address');
      expect(res.status).toBe(400);
      expect(res.body).toMatchObject({ code: 'VALIDATION_FAILED', issues: [{ path: ['email'] }] });
    });
  });

  describe('by password', () => {
    it('signs a member in', async () => {
      const user = await createUser(t.orm.em.fork(), { email: 'member@example.com' });
      const agent = request.agent(t.app);
      const res = await signIn(agent, 'Member@Example.com');
      expect(res.status).toBe(200);
      expect(res.body.url).not.toContain('error=');
      expect((await me(agent)).user.id).toBe(user.id);
    });

    it('gives the same answer for a wrong password and an unknown e-mail', async () => {
      await createUser(t.orm.em.fork(), { email: 'careful@example.com' });
      const wrong = await signIn(request.agent(t.app), 'careful@example.com', 'not the password');
      const unknown = await signIn(request.agent(t.app), 'nobody-here@example.com', 'not the password');
      expect(wrong.status).toBe(unknown.status);
      const path = (url: string) => url.replace(/^http:\/\/[^/]+/, '');
      expect(path(wrong.body.url)).toBe(path(unknown.body.url));
      expect(wrong.body.url).toContain('error=CredentialsSignin');
    });

    it('stops an account after 5 wrong passwords and says when to try again', async () => {
      await createUser(t.orm.em.fork(), { email: 'target@example.com' });
      for (let i = 0; i < 5; i++) await signIn(request.agent(t.app), 'target@example.com', `guess ${i}`);
      const blocked = await signIn(request.agent(t.app), 'target@example.com', TEST_PASSWORD);
      expect(blocked.status).toBe(429);
      expect(blocked.body).toEqual({ code: 'RATE_LIMITED', message: 'Too many sign-in attempts. Try again in 15 minutes.' });
      // Another account from the same address is not affected.
      await createUser(t.orm.em.fork(), { email: 'bystander@example.com' });
      expect((await signIn(request.agent(t.app), 'bystander@example.com')).body.url).not.toContain('error=');
    });

    it('limits attempts per address across accounts', async () => {
      const agent = request.agent(t.app).set('x-forwarded-for', '203.0.113.9');
      let last;
      for (let i = 0; i < 31; i++) last = await signIn(agent, `spray-${i}@example.com`, 'x');
      expect(last!.status).toBe(429);
    });
  });

  it('signs out everywhere: every other session stops working', async () => {
    await createUser(t.orm.em.fork(), { email: 'two-devices@example.com' });
    const phone = request.agent(t.app);
    const laptop = request.agent(t.app);
    await signIn(phone, 'two-devices@example.com');
    await signIn(laptop, 'two-devices@example.com');
    expect((await me(laptop)).user.email).toBe('two-devices@example.com');
    await phone.post('/api/me/sign-out-everywhere').expect(204);
    expect((await me(laptop)).user).toBeNull();
    expect((await me(phone)).user).toBeNull();
    const fresh = await t.orm.em.fork().findOneOrFail(User, { email: 'two-devices@example.com' });
    expect(fresh.sessionVersion).toBe(2);
  });

  it('marks the session cookie Secure when the app is served over https', async () => {
    const secure = await buildTestApp({ APP_URL: 'https://shop.example.com' });
    try {
      await createUser(secure.orm.em.fork(), { email: 'https@example.com' });
      const agent = request.agent(secure.app);
      const csrf = await agent.get('/api/auth/csrf').set('x-forwarded-proto', 'https');
      const cookies = String(csrf.headers['set-cookie']);
      expect(cookies).toMatch(/__Host-authjs\.csrf-token=[^;]+;.*Secure/i);
    } finally {
      await secure.close();
    }
  });
});
