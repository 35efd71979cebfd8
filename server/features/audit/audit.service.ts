import type { EntityManager, FilterQuery } from '@mikro-orm/postgresql';
import { AUDIT_ACTIONS, type AuditAction, type AuditEntryView, type AuditGroup, type AuditPage } from '#shared/schemas/audit.ts';
import { displayName, type User } from '../accounts/user.entity.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { AuditEntry } from './audit-entry.entity.ts';

export type AuditRecord = {
  action: AuditAction;
  subject: string;
  summary: string;
  link?: string | null;
  details?: Record<string, unknown>;
};

/**
 * Adds a line to the studio's audit log. It is only persisted: the caller's flush writes it with
 * the change it describes, so a change that fails leaves no line and no line is ever missing.
 */
export function recordAudit(em: EntityManager, studio: Studio, actor: User, record: AuditRecord): AuditEntry {
  return em.create(AuditEntry, {
    studio,
    actor,
    actorName: displayName(actor).slice(0, 200),
    action: record.action,
    subject: record.subject.slice(0, 200),
    summary: record.summary,
    link: record.link ?? null,
    details: record.details ?? null,
  });
}

const actionsOf = (group: AuditGroup) => (Object.keys(AUDIT_ACTIONS) as AuditAction[]).filter((a) => AUDIT_ACTIONS[a] === group);

const view = (e: AuditEntry): AuditEntryView => ({
  id: e.id,
  at: e.createdAt.toISOString(),
  action: e.action,
  group: AUDIT_ACTIONS[e.action],
  actor: e.actorName,
  subject: e.subject,
  summary: e.summary,
  link: e.link,
});

/** Newest first, a page at a time; `next` marks where the following page starts. */
export async function listAudit(
  em: EntityManager,
  studio: Studio,
  query: { group?: AuditGroup; before?: string; limit: number },
): Promise<AuditPage> {
  const where: FilterQuery<AuditEntry> = { studio };
  if (query.group) where.action = { $in: actionsOf(query.group) };
  if (query.before) {
    const [at, id] = query.before.split('_');
    const when = new Date(at!);
    where.$or = [{ createdAt: { $lt: when } }, { createdAt: when, id: { $lt: id } }];
  }
  const found = await em.find(AuditEntry, where, { orderBy: { createdAt: 'desc', id: 'desc' }, limit: query.limit + 1 });
  const page = found.slice(0, query.limit);
  const last = page.at(-1);
  return { entries: page.map(view), next: found.length > query.limit && last ? `${last.createdAt.toISOString()}_${last.id}` : null };
}

/** "Speed: 300 → 250 mm/s; Passes: 1 → 2": the facts that differ, in their order, or null. */
export function describeChanges(before: Record<string, string>, after: Record<string, string>): string | null {
  const changed = Object.keys(after).filter((label) => before[label] !== after[label]);
  return changed.length ? changed.map((label) => `${label}: ${before[label] ?? '—'} → ${after[label]}`).join('; ') : null;
}

/** "Speed 300 mm/s, passes 1": every fact, for a record made or removed. */
export const describeFacts = (facts: Record<string, string>) =>
  Object.entries(facts)
    .map(([label, value]) => `${label} ${value}`)
    .join(', ');
