import { Entity, Filter, ManyToOne, Property } from '@mikro-orm/core';
import type { PhotoQuality } from '#shared/imaging/photo-checks.ts';
import { BaseEntity } from '#server/db/base.entity.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { Studio } from '../studios/studio.entity.ts';

/**
 * A photo a buyer uploaded to a studio: the original as sent (for production), a screen preview
 * for the designer and a thumbnail, all in object storage. Its id is the buyer's handle on it.
 */
@Entity({ tableName: 'buyer_photo' })
@Filter(tenantFilter)
export class BuyerPhoto extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @Property({ type: 'string', length: 300 }) originalKey!: string;
  @Property({ type: 'string', length: 300 }) previewKey!: string;
  @Property({ type: 'string', length: 300 }) thumbKey!: string;
  @Property({ type: 'string', length: 10 }) format!: string;
  /** Upright size of the original, in pixels. */
  @Property({ type: 'integer' }) width!: number;
  @Property({ type: 'integer' }) height!: number;
  @Property({ type: 'integer' }) previewWidth!: number;
  @Property({ type: 'integer' }) previewHeight!: number;
  @Property({ type: 'integer' }) byteSize!: number;
  @Property({ type: 'json' }) quality!: PhotoQuality;
}
