import { Entity, Enum, Property, Unique } from '@mikro-orm/core';
import type { StudioStatus } from '../../../shared/studio.ts';
import { BaseEntity } from '../../db/base.entity.ts';

/** A tenant: one engraving studio with its own storefront and workspace. */
@Entity({ tableName: 'studio' })
export class Studio extends BaseEntity<'accentColour' | 'status'> {
  @Property({ type: 'string', length: 40 })
  @Unique()
  slug!: string;

  @Property({ type: 'string', length: 120 })
  name!: string;

  /** The storefront's accent colour, `#rrggbb`. */
  @Property({ type: 'string', length: 7 })
  accentColour: string = '#b4532a';

  @Enum({ items: ['active', 'suspended'], type: 'string' })
  status: StudioStatus = 'active';
}
