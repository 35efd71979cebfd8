import { Entity, Enum, Filter, ManyToOne, Property, Unique } from '@mikro-orm/core';
import type { Role } from '#shared/permissions.ts';
import { BaseEntity } from '#server/db/base.entity.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { Studio } from '../studios/studio.entity.ts';
import { User } from '../accounts/user.entity.ts';

/**
 * An invitation to join a studio. The link carries a random token; only its SHA-256 is stored,
 * so the table alone cannot be turned into working links.
 */
@Entity({ tableName: 'invite' })
@Filter(tenantFilter)
export class Invite extends BaseEntity<'usedAt' | 'revokedAt'> {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' })
  studio!: Studio;

  @Property({ type: 'string', length: 254 })
  email!: string;

  @Enum({ items: ['owner', 'staff'], type: 'string' })
  role!: Role;

  @Property({ type: 'string', length: 64, hidden: true })
  @Unique()
  tokenHash!: string;

  @Property({ type: 'datetime' })
  expiresAt!: Date;

  @Property({ type: 'datetime', nullable: true })
  usedAt: Date | null = null;

  @Property({ type: 'datetime', nullable: true })
  revokedAt: Date | null = null;

  @ManyToOne(() => User, { deleteRule: 'set null', nullable: true })
  invitedBy!: User | null;
}
