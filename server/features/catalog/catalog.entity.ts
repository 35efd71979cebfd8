import { Collection, Entity, Enum, Filter, ManyToOne, OneToMany, Property, Unique } from '@mikro-orm/core';
import type { LaserKind } from '#shared/schemas/catalog.ts';
import { BaseEntity } from '#server/db/base.entity.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { Studio } from '../studios/studio.entity.ts';

/** A material as one studio uses it (each studio gets its own copy of the library). */
@Entity({ tableName: 'material' })
@Filter(tenantFilter)
@Unique({ properties: ['studio', 'name'] })
export class Material extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @Property({ type: 'string', length: 80 }) name!: string;
  @Property({ type: 'string', length: 20 }) family!: string;
  @Property({ type: 'string', length: 7 }) surfaceColour!: string;
  @Property({ type: 'string', length: 7 }) markColour!: string;
  @Enum({ items: ['positive', 'negative'], type: 'string' }) defaultTone!: 'positive' | 'negative';
  @Property({ type: 'integer' }) linesPerInchMin!: number;
  @Property({ type: 'integer' }) linesPerInchMax!: number;
  @Property({ type: 'text' }) safetyNotes!: string;
  /** Laser kinds this material must never go on, and why. */
  @Property({ type: 'json' }) forbiddenOn!: LaserKind[];
  @Property({ type: 'string', length: 300 }) forbiddenReason!: string;
}

@Entity({ tableName: 'machine' })
@Filter(tenantFilter)
export class Machine extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @Property({ type: 'string', length: 80 }) name!: string;
  @Enum({ items: ['co2', 'fibre', 'diode'], type: 'string' }) laserKind!: LaserKind;
  @Property({ type: 'double' }) powerWatts!: number;
  @Property({ type: 'double' }) bedWidthMm!: number;
  @Property({ type: 'double' }) bedHeightMm!: number;
  @Enum({ items: ['mm/s', 'in/s', 'percent'], type: 'string' }) speedUnit!: 'mm/s' | 'in/s' | 'percent';
  @Property({ type: 'text' }) notes!: string;
}

/** How one material burns on one machine. */
@Entity({ tableName: 'recipe' })
@Filter(tenantFilter)
@Unique({ properties: ['material', 'machine'] })
export class Recipe extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @ManyToOne(() => Material, { deleteRule: 'cascade' }) material!: Material;
  @ManyToOne(() => Machine, { deleteRule: 'cascade' }) machine!: Machine;
  @Property({ type: 'integer' }) linesPerInch!: number;
  @Property({ type: 'string', length: 40 }) halftoneMethod!: string;
  @Enum({ items: ['positive', 'negative'], type: 'string' }) tone!: 'positive' | 'negative';
  /** In the machine's own speed unit. */
  @Property({ type: 'double' }) speed!: number;
  @Property({ type: 'double' }) powerMinPercent!: number;
  @Property({ type: 'double' }) powerMaxPercent!: number;
  @Property({ type: 'integer' }) passes!: number;
  @Property({ type: 'text' }) notes!: string;
}

@Entity({ tableName: 'blank' })
@Filter(tenantFilter)
export class Blank extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @Property({ type: 'string', length: 120 }) name!: string;
  @Property({ type: 'text' }) description!: string;
  @ManyToOne(() => Material, { deleteRule: 'restrict' }) material!: Material;
  @Enum({ items: ['rectangle', 'rounded-rectangle', 'oval', 'circle'], type: 'string' }) shape!:
    'rectangle' | 'rounded-rectangle' | 'oval' | 'circle';
  @Enum({ items: ['draft', 'active', 'archived'], type: 'string' }) status!: 'draft' | 'active' | 'archived';
  @Property({ type: 'integer' }) sortOrder!: number;
  @OneToMany(() => BlankSize, (size) => size.blank) sizes = new Collection<BlankSize>(this);
  @OneToMany(() => BlankPhoto, (photo) => photo.blank) photos = new Collection<BlankPhoto>(this);
}

/** A product photo of a blank, stored web-ready in object storage under `key`. */
@Entity({ tableName: 'blank_photo' })
@Filter(tenantFilter)
export class BlankPhoto extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @ManyToOne(() => Blank, { deleteRule: 'cascade' }) blank!: Blank;
  @Property({ type: 'string', length: 300 }) key!: string;
  @Property({ type: 'integer' }) width!: number;
  @Property({ type: 'integer' }) height!: number;
  @Property({ type: 'integer' }) sortOrder!: number;
}

@Entity({ tableName: 'blank_size' })
@Filter(tenantFilter)
export class BlankSize extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @ManyToOne(() => Blank, { deleteRule: 'cascade' }) blank!: Blank;
  @Property({ type: 'string', length: 60 }) label!: string;
  @Property({ type: 'double' }) outerWidthMm!: number;
  @Property({ type: 'double' }) outerHeightMm!: number;
  @Property({ type: 'double' }) areaWidthMm!: number;
  @Property({ type: 'double' }) areaHeightMm!: number;
  @Enum({ items: ['portrait', 'landscape', 'either'], type: 'string' }) orientation!: 'portrait' | 'landscape' | 'either';
  /** Integer minor units of the studio's currency. */
  @Property({ type: 'integer' }) priceMinor!: number;
  /** null = unlimited. */
  @Property({ type: 'integer', nullable: true }) stock!: number | null;
  @Property({ type: 'string', length: 60 }) sku!: string;
}
