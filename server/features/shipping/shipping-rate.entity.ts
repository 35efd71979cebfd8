import { Entity, Filter, ManyToOne, Property } from '@mikro-orm/core';
import { BaseEntity } from '#server/db/base.entity.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { Studio } from '../studios/studio.entity.ts';

/** A flat shipping rate a studio offers, such as "Tracked post, 3–5 days". */
@Entity({ tableName: 'shipping_rate' })
@Filter(tenantFilter)
export class ShippingRate extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @Property({ type: 'string', length: 80 }) name!: string;
  @Property({ type: 'integer' }) priceMinor!: number;
  @Property({ type: 'integer' }) sortOrder!: number;
}
