import { Entity, Filter, Index, ManyToOne, OptionalProps, PrimaryKey, Property } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import type { AuditAction } from '#shared/schemas/audit.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { User } from '../accounts/user.entity.ts';
import { Studio } from '../studios/studio.entity.ts';

/**
 * One line of a studio's audit log. Written in the same flush as the change it records, and
 * never changed afterwards. The actor's name is copied in, so the line still reads right after
 * the member has left; the subject is text for the same reason.
 */
@Entity({ tableName: 'audit_entry' })
@Filter(tenantFilter)
@Index({ properties: ['studio', 'createdAt', 'id'] })
export class AuditEntry {
  [OptionalProps]?: 'createdAt' | 'actor' | 'link' | 'details';
  @PrimaryKey({ type: 'uuid' }) id: string = randomUUID();
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @Property({ type: 'datetime', defaultRaw: 'now()' }) createdAt: Date = new Date();
  @ManyToOne(() => User, { nullable: true, deleteRule: 'set null' }) actor: User | null = null;
  @Property({ type: 'string', length: 200 }) actorName!: string;
  @Property({ type: 'string', length: 40 }) action!: AuditAction;
  @Property({ type: 'string', length: 200 }) subject!: string;
  @Property({ type: 'text' }) summary!: string;
  @Property({ type: 'string', length: 300, nullable: true }) link: string | null = null;
  /** The values behind the summary (amounts in minor units, ids, old and new settings). */
  @Property({ type: 'json', nullable: true }) details: Record<string, unknown> | null = null;
}
