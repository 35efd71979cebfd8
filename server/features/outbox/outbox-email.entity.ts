import { Entity, Enum, Index, Property } from '@mikro-orm/core';
import { BaseEntity } from '#server/db/base.entity.ts';

/**
 * An e-mail waiting to be sent, or sent. Features write a row in the same transaction as the
 * change it tells about, so no e-mail is lost when the mail server is down; the sender delivers
 * due rows with retries.
 */
@Entity({ tableName: 'outbox_email' })
@Index({ properties: ['status', 'nextAttemptAt'] })
export class OutboxEmail extends BaseEntity<
  'status' | 'attempts' | 'nextAttemptAt' | 'lastError' | 'sentAt' | 'html' | 'heldForOrder' | 'fromName' | 'replyTo'
> {
  @Property({ type: 'string', length: 254 })
  to!: string;

  @Property({ type: 'string', length: 300 })
  subject!: string;

  @Property({ type: 'text' })
  text!: string;

  @Property({ type: 'text', nullable: true })
  html: string | null = null;

  /** The sender's name when it is not Etchwell's (a studio writing to its buyer); the address stays ours. */
  @Property({ type: 'string', length: 120, nullable: true })
  fromName: string | null = null;

  /** Where answers go: the studio's contact address for mail to its buyers. */
  @Property({ type: 'string', length: 254, nullable: true })
  replyTo: string | null = null;

  /** `held`: written but not to be sent until its order is paid (the buyer's receipt). */
  @Enum({ items: ['held', 'pending', 'sent', 'failed'], type: 'string' })
  status: 'held' | 'pending' | 'sent' | 'failed' = 'pending';

  @Property({ type: 'integer' })
  attempts: number = 0;

  @Property({ type: 'datetime', defaultRaw: 'now()' })
  nextAttemptAt: Date = new Date();

  @Property({ type: 'text', nullable: true })
  lastError: string | null = null;

  @Property({ type: 'datetime', nullable: true })
  sentAt: Date | null = null;

  /** The order whose payment releases this e-mail, while it is held. */
  @Index({ name: 'outbox_email_held_for_order_id_index' })
  @Property({ type: 'uuid', fieldName: 'held_for_order_id', nullable: true })
  heldForOrder: string | null = null;
}
