import { Collection, Entity, Enum, Filter, Index, ManyToOne, OneToMany, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import type { Address, Handover, Inscription, Placement } from '#shared/schemas/checkout.ts';
import type { PrepVersion } from '#shared/schemas/prep.ts';
import { ITEM_STAGES, ORDER_STATUSES, type ItemStage, type OrderStatus } from '#shared/orders/stages.ts';
import { BaseEntity } from '#server/db/base.entity.ts';
import { tenantFilter } from '#server/db/tenant.ts';
import { Studio } from '../studios/studio.entity.ts';
import { BlankSize } from '../catalog/catalog.entity.ts';
import { BuyerPhoto } from '../photos/buyer-photo.entity.ts';
import type { snapshotForOrder } from '../catalog/catalog.service.ts';

/** A buyer's order at one studio. Money is in the studio's currency at the time of ordering. */
@Entity({ tableName: 'order' })
@Filter(tenantFilter)
@Unique({ properties: ['studio', 'number'] })
export class Order extends BaseEntity<'refundedMinor'> {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  /** Shown to people: counts up per studio. */
  @Property({ type: 'integer' }) number!: number;
  @Enum({ items: [...ORDER_STATUSES], type: 'string' }) status!: OrderStatus;
  @Property({ type: 'string', length: 254 }) buyerEmail!: string;
  @Property({ type: 'string', length: 120 }) buyerName!: string;
  @Enum({ items: ['ship', 'pickup'], type: 'string' }) deliveryMethod!: 'ship' | 'pickup';
  @Property({ type: 'json', nullable: true }) shippingAddress!: Address | null;
  /** The rate as chosen: later edits to the studio's rates do not change it. */
  @Property({ type: 'json', nullable: true }) shippingRate!: { id: string; name: string; priceMinor: number } | null;
  @Property({ type: 'string', length: 3 }) currency!: string;
  @Property({ type: 'integer' }) subtotalMinor!: number;
  @Property({ type: 'integer' }) shippingMinor!: number;
  @Property({ type: 'integer' }) totalMinor!: number;
  /** What has been paid back so far. */
  @Property({ type: 'integer' }) refundedMinor: number = 0;
  /** SHA-256 of the private link's key: the table alone opens no order. */
  @Property({ type: 'string', length: 64 }) accessKeyHash!: string;
  @Property({ type: 'string', length: 120, nullable: true }) @Index() checkoutSessionId: string | null = null;
  @Property({ type: 'string', length: 120, nullable: true }) paymentIntentId: string | null = null;
  @Property({ type: 'datetime', nullable: true }) paidAt: Date | null = null;
  /** Something the buyer should know about the order as a whole (a refund after a sell-out…). */
  @Property({ type: 'text', nullable: true }) note: string | null = null;
  @OneToMany(() => OrderItem, (item) => item.order, { orderBy: { position: 'asc', createdAt: 'asc' } }) items = new Collection<OrderItem>(
    this,
  );
  @OneToMany(() => OrderEvent, (event) => event.order) events = new Collection<OrderEvent>(this);
}

@Entity({ tableName: 'order_item' })
@Filter(tenantFilter)
export class OrderItem extends BaseEntity<
  | 'replacementTokenHash'
  | 'replacementReason'
  | 'replacementNote'
  | 'replacements'
  | 'prepVersions'
  | 'proofTokenHash'
  | 'handover'
  | 'proofImageKey'
  | 'position'
> {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @ManyToOne(() => Order, { deleteRule: 'cascade' }) order!: Order;
  @Enum({ items: [...ITEM_STAGES], type: 'string' }) stage!: ItemStage;
  /** Where the item stood in the cart: items are listed, and numbered on job sheets, in this order. */
  @Property({ type: 'integer' }) position: number = 0;
  /** For stock only; everything shown comes from the snapshot. */
  @ManyToOne(() => BlankSize, { nullable: true, deleteRule: 'set null' }) size!: BlankSize | null;
  @Property({ type: 'json' }) snapshot!: ReturnType<typeof snapshotForOrder>;
  @Property({ type: 'integer' }) quantity!: number;
  @Property({ type: 'integer' }) unitPriceMinor!: number;
  @ManyToOne(() => BuyerPhoto, { deleteRule: 'restrict' }) photo!: BuyerPhoto;
  @Property({ type: 'json' }) placement!: Placement;
  @Enum({ items: ['portrait', 'landscape'], type: 'string' }) orientation!: 'portrait' | 'landscape';
  @Property({ type: 'json', nullable: true }) inscription!: Inscription | null;
  @Property({ type: 'integer' }) effectivePpi!: number;
  @Property({ type: 'boolean' }) lowResolutionConfirmed!: boolean;
  /** While a new photo is asked for: the SHA-256 of the buyer's upload link's token, and why. */
  @Property({ type: 'string', length: 64, nullable: true }) replacementTokenHash: string | null = null;
  @Property({ type: 'string', length: 40, nullable: true }) replacementReason: string | null = null;
  @Property({ type: 'text' }) replacementNote: string = '';
  /** How many times the buyer has sent a new photo. */
  @Property({ type: 'integer' }) replacements: number = 0;
  /** Every saved version of the prep settings, newest last; the last one is what burns. */
  @Property({ type: 'json', defaultRaw: "'[]'" }) prepVersions: PrepVersion[] = [];
  /** While a proof waits for the buyer: the SHA-256 of the proof link's token. */
  @Property({ type: 'string', length: 64, nullable: true }) proofTokenHash: string | null = null;
  /** The last proof sent, as rendered on the server. */
  @Property({ type: 'string', length: 300, nullable: true }) proofImageKey: string | null = null;
  /** How the item left the studio, once it has. */
  @Property({ type: 'json', nullable: true }) handover: Handover | null = null;
}

/** One thing that happened to an order: who, when, what and why. Never changed once written. */
@Entity({ tableName: 'order_event' })
@Filter(tenantFilter)
export class OrderEvent extends BaseEntity {
  @ManyToOne(() => Studio, { deleteRule: 'cascade' }) studio!: Studio;
  @ManyToOne(() => Order, { deleteRule: 'cascade' }) order!: Order;
  @ManyToOne(() => OrderItem, { nullable: true, deleteRule: 'cascade' }) item: OrderItem | null = null;
  @Property({ type: 'string', length: 40 }) type!: string;
  /** "buyer", "payments", or a member's name. */
  @Property({ type: 'string', length: 120 }) actor!: string;
  @Property({ type: 'text' }) text!: string;
}

/** Payment events already handled, by the provider's event id: each is acted on once. */
@Entity({ tableName: 'payment_event' })
export class PaymentEvent {
  @PrimaryKey({ type: 'string', length: 120 }) id!: string;
  @Property({ type: 'string', length: 80 }) type!: string;
  @Property({ type: 'datetime', defaultRaw: 'now()' }) processedAt: Date = new Date();
}
