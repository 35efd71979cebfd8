import { Entity, Index, Property } from '@mikro-orm/core';
import { BaseEntity } from '#server/db/base.entity.ts';

/**
 * A person who signs in: a buyer, a studio member, or a platform admin. The e-mail is stored in
 * lower case and unique (a unique index on lower(email) guards against any other writer).
 */
@Entity({ tableName: 'app_user' })
@Index({
  name: 'app_user_email_lower_unique',
  expression: 'create unique index "app_user_email_lower_unique" on "app_user" (lower("email"))',
})
export class User extends BaseEntity<'name' | 'passwordHash' | 'emailVerifiedAt' | 'isPlatformAdmin' | 'sessionVersion'> {
  @Property({ type: 'string', length: 254 })
  email!: string;

  @Property({ type: 'string', length: 120, nullable: true })
  name: string | null = null;

  /** argon2id; members may have one, buyers sign in by e-mailed link only. */
  @Property({ type: 'string', length: 200, nullable: true, hidden: true })
  passwordHash: string | null = null;

  @Property({ type: 'datetime', nullable: true })
  emailVerifiedAt: Date | null = null;

  @Property({ type: 'boolean' })
  isPlatformAdmin: boolean = false;

  /** Sessions carry this number; raising it signs the user out everywhere. */
  @Property({ type: 'integer' })
  sessionVersion: number = 1;
}

/** How a person appears on timelines, job sheets, e-mails and the audit log: their name, else their e-mail. */
export const displayName = (user: Pick<User, 'name' | 'email'>) => user.name ?? user.email;
