import type { EntityManager } from '@mikro-orm/postgresql';
import type { User } from '../accounts/user.entity.ts';
import { AuditEntry } from '../audit/audit-entry.entity.ts';
import { recordAudit } from '../audit/audit.service.ts';
import type { BuyerPhoto } from '../photos/buyer-photo.entity.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { OrderItem } from './order.entity.ts';
import { workspaceOrderPath } from './order.views.ts';

/**
 * How long the browser keeps an original photo (its cache-control): within it, the same member
 * opening the same photo again is one download, not a line per page view.
 */
const SAME_DOWNLOAD_MS = 3600_000;

/** Logs that a member fetched a buyer's original photo, and flushes the line before it is sent. */
export async function recordPhotoDownload(em: EntityManager, studio: Studio, user: User, photo: BuyerPhoto): Promise<void> {
  const recent = await em.count(AuditEntry, {
    studio,
    actor: user,
    action: 'photo.downloaded',
    createdAt: { $gt: new Date(Date.now() - SAME_DOWNLOAD_MS) },
    details: { photoId: photo.id },
  });
  if (recent) return;
  const item = await em.findOne(OrderItem, { studio, photo }, { populate: ['order'] });
  recordAudit(em, studio, user, {
    action: 'photo.downloaded',
    subject: item ? `Order ${item.order.number}` : 'A photo not in an order',
    summary: `Opened the original photo (${photo.width} × ${photo.height} px)${item ? ` for ${item.snapshot.blank.name}, ${item.snapshot.size.label}` : ''}.`,
    link: item ? workspaceOrderPath(studio.slug, item.order.id) : null,
    details: { photoId: photo.id, itemId: item?.id ?? null },
  });
  await em.flush();
}
