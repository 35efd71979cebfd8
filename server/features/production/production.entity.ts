import { Collection, Entity, Enum, Filter, ManyToOne, OneToMany, Property, Unique } from '@mikro-orm/core';
import { RENDER_STATUSES, type BatchMachine, type RenderFiles, type RenderStatus } from '#shared/schemas/production.ts';
import { BaseEntity } from '#server/db/base.entity.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { Studio } from '../studios/studio.entity.ts';
import { OrderItem } from '../orders/order.entity.ts';

/**
 * Approved items of one material and one machine recipe, sent to production together: one run
 * of the machine with the same settings. Named by the material and machine as they were then.
 */
@Entity({ tableName: 'production_batch' })
@Filter(tenantFilter)
@Unique({ properties: ['studio', 'number'] })
export class ProductionBatch extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  /** Shown to people: counts up per studio. */
  @Property({ type: 'integer' }) number!: number;
  @Property({ type: 'string', length: 120 }) materialName!: string;
  @Property({ type: 'uuid', nullable: true }) recipeId!: string | null;
  /** The machine and its settings as the batch was started; null for blanks without a recipe. */
  @Property({ type: 'json', nullable: true }) machine!: BatchMachine | null;
  @Property({ type: 'string', length: 120 }) createdBy!: string;
  @OneToMany(() => Render, (render) => render.batch) renders = new Collection<Render>(this);
}

/**
 * The files one item burns from: the engrave file, the grayscale master and the job sheet, made
 * by a background job. Every attempt writes the same three keys under `keyPrefix`, and the row
 * becomes `done` only after all three are stored, so a worker that dies half-way leaves a render
 * that is redone, never a half set marked done.
 */
@Entity({ tableName: 'render' })
@Filter(tenantFilter)
export class Render extends BaseEntity<'progress' | 'step' | 'attempts' | 'error' | 'files' | 'startedAt' | 'finishedAt'> {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @ManyToOne(() => OrderItem, { deleteRule: 'cascade', unique: true }) item!: OrderItem;
  @ManyToOne(() => ProductionBatch, { deleteRule: 'cascade' }) batch!: ProductionBatch;
  @Enum({ items: [...RENDER_STATUSES], type: 'string' }) status!: RenderStatus;
  /** 0–100, with what the worker is doing now. */
  @Property({ type: 'integer' }) progress: number = 0;
  @Property({ type: 'string', length: 80 }) step: string = 'Waiting for a worker';
  @Property({ type: 'integer' }) attempts: number = 0;
  @Property({ type: 'text', nullable: true }) error: string | null = null;
  /** Unguessable: studios/<studio>/renders/<random uuid>. */
  @Property({ type: 'string', length: 200 }) keyPrefix!: string;
  /** The prep version the files were made from. */
  @Property({ type: 'integer' }) prepVersion!: number;
  @Property({ type: 'json', nullable: true }) files: RenderFiles | null = null;
  @Property({ type: 'datetime', nullable: true }) startedAt: Date | null = null;
  @Property({ type: 'datetime', nullable: true }) finishedAt: Date | null = null;
}
