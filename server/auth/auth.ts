import type { Request, RequestHandler } from 'express';
import express from 'express';
import { ExpressAuth, getSession, type ExpressAuthConfig } from '@auth/express';
import Credentials from '@auth/express/providers/credentials';
import Nodemailer from '@auth/express/providers/nodemailer';
import { emailSchema } from '#shared/schemas/accounts.ts';
import { AppError } from '#shared/errors.ts';
import type { Env } from '../env.ts';
import type { Orm } from '../db/orm.ts';
import type { Logger } from '../logger.ts';
import { User } from '../features/accounts/user.entity.ts';
import { mikroOrmAdapter, toAdapterUser } from './adapter.ts';
import { dummyPasswordHash, verifyPassword } from './password.ts';
import type { RateLimits } from '../lib/rate-limits.ts';
import { signInLinkMail } from './sign-in-mail.ts';
import { queueEmail } from '../features/outbox/outbox.service.ts';

/**
 * Sign-in for everyone, through Auth.js mounted at /api/auth: an e-mailed link for anyone
 * (buyers and members) and a password for members who set one. Sessions are JWTs in an httpOnly,
 * SameSite=Lax cookie (Secure, with the __Secure- prefix, when APP_URL is https). Each session
 * carries the user's session version; raising it signs the user out everywhere.
 *
 * All sign-in service code lives in this folder: its API is marked experimental.
 */
export type Auth = {
  /** Mount at /api/auth. */
  router: express.Router;
  /** The signed-in user of this request, or null. */
  currentUser(req: Request): Promise<User | null>;
};

const SESSION_MAX_AGE = 30 * 24 * 3600;
const LINK_MAX_AGE = 30 * 60;

export function createAuth({
  orm,
  env,
  logger,
  limits: { signIn: limits },
}: {
  orm: Orm;
  env: Env;
  logger: Logger;
  limits: RateLimits;
}): Auth {
  const secure = env.APP_URL.startsWith('https://');

  const config: ExpressAuthConfig = {
    secret: env.AUTH_SECRET,
    trustHost: true,
    basePath: '/api/auth',
    useSecureCookies: secure,
    adapter: mikroOrmAdapter(orm),
    session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE },
    pages: { signIn: '/sign-in', error: '/sign-in', verifyRequest: '/sign-in/link-sent' },
    // The service's own messages go to our log; a refused password is an answer, not an error.
    logger: {
      error(error) {
        if (error.name === 'CredentialsSignin') return;
        logger.error({ err: error }, 'sign-in service error');
      },
      warn(code) {
        logger.warn({ code }, 'sign-in service warning');
      },
      debug() {},
    },
    providers: [
      Credentials({
        credentials: { email: { type: 'email' }, password: { type: 'password' } },
        async authorize(credentials) {
          const email = emailSchema.safeParse(credentials.email);
          const password = typeof credentials.password === 'string' ? credentials.password : '';
          const user = email.success ? await orm.em.fork().findOne(User, { email: email.data }) : null;
          // The same work and the same answer for an unknown e-mail as for a wrong password.
          const ok = await verifyPassword(user?.passwordHash ?? (await dummyPasswordHash()), password);
          if (!user || !user.passwordHash || !ok) {
            if (email.success) await limits.recordPasswordFailure(email.data);
            return null;
          }
          await limits.recordPasswordSuccess(user.email);
          return toAdapterUser(user);
        },
      }),
      Nodemailer({
        server: env.SMTP_URL,
        from: env.MAIL_FROM,
        maxAge: LINK_MAX_AGE,
        async sendVerificationRequest({ identifier, url }) {
          const em = orm.em.fork();
          queueEmail(em, { to: identifier, ...signInLinkMail(url, LINK_MAX_AGE / 60) });
          await em.flush();
        },
      }),
    ],
    callbacks: {
      jwt({ token, user }) {
        if (user) token.sv = (user as { sessionVersion?: number }).sessionVersion ?? 1;
        return token;
      },
      session({ session, token }) {
        return { ...session, user: { ...session.user, id: token.sub! }, sv: token.sv } as typeof session;
      },
      redirect({ url, baseUrl }) {
        // Only back into this app, never elsewhere.
        if (url.startsWith('/')) return `${baseUrl}${url}`;
        return new URL(url).origin === baseUrl ? url : baseUrl;
      },
    },
  };

  const router = express.Router();
  router.use(express.urlencoded({ extended: false, limit: '10kb' }));
  // Limits are checked before the sign-in service sees the attempt, with the caller's address.
  const limitPassword: RequestHandler = async (req, _res, next) => {
    const email = emailSchema.safeParse(req.body?.email);
    await limits.checkPasswordAttempt(req.ip ?? 'unknown', email.success ? email.data : String(req.body?.email ?? ''));
    next();
  };
  const limitLinks: RequestHandler = async (req, _res, next) => {
    const email = emailSchema.safeParse(req.body?.email);
    if (!email.success)
      throw new AppError('VALIDATION_FAILED', 'Enter a valid e-mail address.', {
        issues: [{ path: ['email'], message: 'Enter a valid e-mail address.' }],
      });
    await limits.checkLinkRequest(req.ip ?? 'unknown', email.data);
    next();
  };
  router.post('/callback/credentials', limitPassword);
  router.post('/signin/nodemailer', limitLinks);
  router.use(ExpressAuth(config));

  return {
    router,
    async currentUser(req) {
      const session = (await getSession(req, config)) as { user?: { id?: string }; sv?: number } | null;
      const id = session?.user?.id;
      if (!id) return null;
      const user = await orm.em.findOne(User, { id });
      if (!user || user.sessionVersion !== session.sv) return null;
      return user;
    },
  };
}
