import { Entity, Enum, Filter, ManyToOne, Unique } from '@mikro-orm/core';
import type { Role } from '#shared/permissions.ts';
import { BaseEntity } from '#server/db/base.entity.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { Studio } from '../studios/studio.entity.ts';
import { User } from '../accounts/user.entity.ts';

/** A user's role in one studio; a user may belong to several studios. */
@Entity({ tableName: 'membership' })
@Filter(tenantFilter)
@Unique({ properties: ['studio', 'user'] })
export class Membership extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' })
  studio!: Studio;

  @ManyToOne(() => User, { deleteRule: 'cascade' })
  user!: User;

  @Enum({ items: ['owner', 'staff'], type: 'string' })
  role!: Role;
}
