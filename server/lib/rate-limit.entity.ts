import { Entity, PrimaryKey, Property } from '@mikro-orm/core';

/**
 * Counters of the rate limits (sign-in, sign-up, invites, photo uploads), in the shape the rate
 * limiter library reads and writes (it is given `tableCreated: true`). Declared here so the
 * schema tools know the table.
 */
@Entity({ tableName: 'rate_limit' })
export class RateLimit {
  @PrimaryKey({ type: 'string', length: 255 })
  key!: string;

  @Property({ type: 'integer', default: 0 })
  points!: number;

  /** Milliseconds since the epoch when the counter resets. */
  @Property({ type: 'bigint', nullable: true })
  expire!: string | null;
}
