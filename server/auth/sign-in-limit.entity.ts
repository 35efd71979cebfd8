import { Entity, PrimaryKey, Property } from '@mikro-orm/core';

/**
 * Counters of the sign-in rate limiter, in the shape the rate limiter library reads and writes
 * (it is given `tableCreated: true`). Declared here so the schema tools know the table.
 */
@Entity({ tableName: 'sign_in_limit' })
export class SignInLimit {
  @PrimaryKey({ type: 'string', length: 255 })
  key!: string;

  @Property({ type: 'integer', default: 0 })
  points!: number;

  /** Milliseconds since the epoch when the counter resets. */
  @Property({ type: 'bigint', nullable: true })
  expire!: string | null;
}
