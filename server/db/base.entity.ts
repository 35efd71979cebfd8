import { randomUUID } from 'node:crypto';
import { OptionalProps, PrimaryKey, Property } from '@mikro-orm/core';

/**
 * Fields every table has. Properties carry an explicit `type` because the code runs under
 * esbuild (tsx, vitest), which emits no decorator metadata for MikroORM to read.
 */
export abstract class BaseEntity<Optional = never> {
  [OptionalProps]?: 'createdAt' | 'updatedAt' | Optional;

  @PrimaryKey({ type: 'uuid' })
  id: string = randomUUID();

  @Property({ type: 'datetime', defaultRaw: 'now()' })
  createdAt: Date = new Date();

  @Property({ type: 'datetime', defaultRaw: 'now()', onUpdate: () => new Date() })
  updatedAt: Date = new Date();
}
