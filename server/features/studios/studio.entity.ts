import { Entity, Enum, Property, Unique } from '@mikro-orm/core';
import type { StudioStatus } from '../../../shared/studio.ts';
import { BaseEntity } from '../../db/base.entity.ts';

/** A tenant: one engraving studio with its own storefront and workspace. */
@Entity({ tableName: 'studio' })
export class Studio extends BaseEntity<'accentColour' | 'status' | 'currency' | 'units' | 'contactEmail' | 'logoKey'> {
  @Property({ type: 'string', length: 40 })
  @Unique()
  slug!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** The storefront's accent colour, `#rrggbb`. */
  @Property({ type: 'string', length: 7 })
  accentColour: string = '#b4532a';

  /** Object key of the logo in the object store, when the studio has one. */
  @Property({ type: 'string', length: 300, nullable: true })
  logoKey: string | null = null;

  /** ISO 4217 code; prices are integers in this currency's minor unit. */
  @Property({ type: 'string', length: 3 })
  currency: string = 'USD';

  /** How sizes are shown to this studio's people; they are stored in mm. */
  @Enum({ items: ['in', 'mm'], type: 'string' })
  units: 'in' | 'mm' = 'in';

  @Property({ type: 'string', length: 254, nullable: true })
  contactEmail: string | null = null;

  @Enum({ items: ['active', 'suspended'], type: 'string' })
  status: StudioStatus = 'active';
}
