import { Studio } from '../features/studios/studio.entity.ts';
import { User } from '../features/accounts/user.entity.ts';
import { Membership } from '../features/team/membership.entity.ts';
import { Invite } from '../features/team/invite.entity.ts';
import { VerificationToken } from '../auth/verification-token.entity.ts';
import { OutboxEmail } from '../features/outbox/outbox-email.entity.ts';
import { RateLimit } from '../lib/rate-limit.entity.ts';
import { Blank, BlankPhoto, BlankSize, Machine, Material, Recipe } from '../features/catalog/catalog.entity.ts';

import { BuyerPhoto } from '../features/photos/buyer-photo.entity.ts';

import { ShippingRate } from '../features/shipping/shipping-rate.entity.ts';
import { Order, OrderEvent, OrderItem, PaymentEvent } from '../features/orders/order.entity.ts';
import { ProductionBatch, Render } from '../features/production/production.entity.ts';
import { AuditEntry } from '../features/audit/audit-entry.entity.ts';

/** Every entity the ORM knows, listed by hand: discovery by folder scan needs compiled files. */
export const entities = [
  Studio,
  User,
  Membership,
  Invite,
  VerificationToken,
  OutboxEmail,
  RateLimit,
  Material,
  Machine,
  Recipe,
  Blank,
  BlankSize,
  BlankPhoto,
  BuyerPhoto,
  ShippingRate,
  Order,
  OrderItem,
  OrderEvent,
  PaymentEvent,
  ProductionBatch,
  Render,
  AuditEntry,
];
