import { Entity, PrimaryKey, Property } from '@mikro-orm/core';

/**
 * One-time tokens for e-mailed links: sign-in links (the sign-in service stores the token
 * already hashed) and e-mail address confirmations (`identifier` prefixed `verify:`).
 */
@Entity({ tableName: 'verification_token' })
export class VerificationToken {
  @PrimaryKey({ type: 'string', length: 300 })
  identifier!: string;

  @PrimaryKey({ type: 'string', length: 128 })
  token!: string;

  @Property({ type: 'datetime' })
  expires!: Date;
}
