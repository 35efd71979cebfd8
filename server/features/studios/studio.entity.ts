import { Entity, Enum, Property, Unique } from '@mikro-orm/core';
import type { MasterResolution } from '#shared/studio.ts';
import type { StudioStatus } from '#shared/studio.ts';
import { BaseEntity } from '#server/db/base.entity.ts';

/** A tenant: one engraving studio with its own storefront and workspace. */
@Entity({ tableName: 'studio' })
export class Studio extends BaseEntity<
  | 'accentColour'
  | 'status'
  | 'currency'
  | 'units'
  | 'contactEmail'
  | 'logoKey'
  | 'lowResolutionPolicy'
  | 'pickupEnabled'
  | 'pickupNote'
  | 'nextOrderNumber'
  | 'proofsRequired'
  | 'masterResolution'
> {
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

  /** Whether a photo too low in resolution for its size is refused, or ordered once the buyer confirms. */
  @Enum({ items: ['confirm', 'refuse'], type: 'string' })
  lowResolutionPolicy: 'confirm' | 'refuse' = 'confirm';

  @Property({ type: 'boolean' })
  pickupEnabled: boolean = false;

  /** When false, staff approve prepared items themselves; no proof goes to the buyer. */
  @Property({ type: 'boolean' })
  proofsRequired: boolean = true;

  /** The grayscale master's resolution: 1000 ppi, or the recipe's line density (`MASTER_RESOLUTIONS`). */
  @Enum({ items: ['1000-ppi', 'recipe'], type: 'string' })
  masterResolution: MasterResolution = '1000-ppi';

  /** Where and when buyers collect, shown at checkout. */
  @Property({ type: 'string', length: 300 })
  pickupNote: string = '';

  /** Order numbers count up per studio from the number the owner chose (1 unless changed), taken with a row lock. */
  @Property({ type: 'integer', default: 1 })
  nextOrderNumber: number = 1;
}
