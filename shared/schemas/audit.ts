import { z } from 'zod';

/**
 * The audit log: sensitive things members did in a studio, kept for the owners to read.
 * Each action belongs to one group, which is what the workspace page filters by.
 */
export const AUDIT_ACTIONS = {
  'order.refunded': 'money',
  'order.cancelled': 'money',
  'member.role_changed': 'team',
  'member.removed': 'team',
  'member.joined': 'team',
  'invite.sent': 'team',
  'invite.revoked': 'team',
  'price.changed': 'prices',
  'recipe.created': 'recipes',
  'recipe.changed': 'recipes',
  'recipe.deleted': 'recipes',
  'photo.downloaded': 'photos',
  'render.downloaded': 'photos',
} as const;
export type AuditAction = keyof typeof AUDIT_ACTIONS;

export const AUDIT_GROUPS = {
  money: 'Refunds and cancellations',
  team: 'Team and roles',
  prices: 'Prices',
  recipes: 'Machine recipes',
  photos: "Buyers' photos downloaded",
} as const;
export type AuditGroup = keyof typeof AUDIT_GROUPS;

export const auditListQuerySchema = z.object({
  group: z.enum(Object.keys(AUDIT_GROUPS) as [AuditGroup, ...AuditGroup[]]).optional(),
  /** The `next` of the previous page: entries older than it. */
  before: z.string().regex(/^\d{4}-\d{2}-\d{2}T[\d:.]+Z_[0-9a-f-]{36}$/, 'Not a page marker from this list.').optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});
export type AuditListQuery = z.input<typeof auditListQuerySchema>;

export type AuditEntryView = {
  id: string;
  at: string;
  action: AuditAction;
  group: AuditGroup;
  /** The member's name (or e-mail) at the time. */
  actor: string;
  /** What it was done to, e.g. "Order 1042" or "Slate, 8 × 10 in". */
  subject: string;
  /** One sentence: what changed, from what to what. */
  summary: string;
  /** Where in the workspace the subject lives, when it still can be opened. */
  link: string | null;
};

export type AuditPage = { entries: AuditEntryView[]; next: string | null };
