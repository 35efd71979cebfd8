import type { Adapter, AdapterUser, VerificationToken as AuthToken } from '@auth/express/adapters';
import type { Orm } from '../db/orm.ts';
import { User } from '../features/accounts/user.entity.ts';
import { VerificationToken } from './verification-token.entity.ts';

/**
 * The sign-in service's storage, over our own entities: users and one-time link tokens. Sessions
 * are JWTs, so only what e-mailed links need is here.
 */
export function toAdapterUser(user: User): AdapterUser & { sessionVersion: number } {
  return { id: user.id, email: user.email, name: user.name, emailVerified: user.emailVerifiedAt, sessionVersion: user.sessionVersion };
}

export function mikroOrmAdapter(orm: Orm): Adapter {
  const em = () => orm.em.fork();
  return {
    async createUser(data) {
      const fork = em();
      const user = fork.create(User, {
        email: data.email.toLowerCase(),
        name: data.name ?? null,
        emailVerifiedAt: data.emailVerified ?? null,
      });
      await fork.flush();
      return toAdapterUser(user);
    },
    async getUser(id) {
      const user = await em().findOne(User, { id });
      return user ? toAdapterUser(user) : null;
    },
    async getUserByEmail(email) {
      const user = await em().findOne(User, { email: email.toLowerCase() });
      return user ? toAdapterUser(user) : null;
    },
    async updateUser(data) {
      const fork = em();
      const user = await fork.findOneOrFail(User, { id: data.id });
      if (data.name !== undefined) user.name = data.name;
      if (data.emailVerified !== undefined) user.emailVerifiedAt = data.emailVerified;
      await fork.flush();
      return toAdapterUser(user);
    },
    async getUserByAccount() {
      return null; // no third-party accounts
    },
    async createVerificationToken(token: AuthToken) {
      const fork = em();
      fork.create(VerificationToken, { identifier: token.identifier, token: token.token, expires: token.expires });
      await fork.flush();
      return token;
    },
    /** Single use: the row is deleted as it is read, in one statement. */
    async useVerificationToken({ identifier, token }) {
      const rows = await em()
        .getConnection()
        .execute<Array<{ identifier: string; token: string; expires: Date }>>(
          'delete from verification_token where identifier = ? and token = ? returning identifier, token, expires',
          [identifier, token],
        );
      const row = rows[0];
      return row ? { identifier: row.identifier, token: row.token, expires: new Date(row.expires) } : null;
    },
  };
}
