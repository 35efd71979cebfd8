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
  'blank.created': 'blanks',
  'blank.status_changed': 'blanks',
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
  blanks: 'Blanks on sale',
  recipes: 'Machine recipes',
  photos: "Buyers' photos downloaded",
} as const;
export type AuditGroup = keyof typeof AUDIT_GROUPS;
const auditGroupSchema = z.enum(Object.keys(AUDIT_GROUPS) as [AuditGroup, ...AuditGroup[]]);

export const auditListQuerySchema = z.object({
  group: auditGroupSchema.optional(),
  /** The `next` of the previous page: entries older than it. */
  before: z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}T[\d:.]+Z_[0-9a-f-]{36}$/, 'Not a page marker from this list.')
    .optional(),
  limit: z.coerce.number().int().min(1).max(100).default(50),
});
export type AuditListQuery = z.input<typeof auditListQuerySchema>;

/** How each action is named on the audit log page. */
export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  'order.refunded': 'Refund',
  'order.cancelled': 'Cancellation',
  'member.role_changed': 'Role changed',
  'member.removed': 'Member removed',
  'member.joined': 'Member joined',
  'invite.sent': 'Invitation sent',
  'invite.revoked': 'Invitation withdrawn',
  'price.changed': 'Price changed',
  'blank.created': 'Blank added',
  'blank.status_changed': 'Blank on or off sale',
  'recipe.created': 'Recipe added',
  'recipe.changed': 'Recipe changed',
  'recipe.deleted': 'Recipe deleted',
  'photo.downloaded': 'Original photo opened',
  'render.downloaded': 'Render file downloaded',
};

export const auditEntrySchema = z.object({
  id: z.string(),
  at: z.string(),
  action: z.enum(Object.keys(AUDIT_ACTIONS) as [AuditAction, ...AuditAction[]]),
  group: auditGroupSchema,
  /** The member's name (or e-mail) at the time. */
  actor: z.string(),
  /** What it was done to, e.g. "Order 1042" or "Slate, 8 × 10 in". */
  subject: z.string(),
  /** One sentence: what changed, from what to what. */
  summary: z.string(),
  /** Where in the workspace the subject lives, when it still can be opened. */
  link: z.string().nullable(),
});
export type AuditEntryView = z.infer<typeof auditEntrySchema>;

export const auditPageSchema = z.object({ entries: z.array(auditEntrySchema), next: z.string().nullable() });
export type AuditPage = z.infer<typeof auditPageSchema>;
