/**
 * The one permission map. The server enforces it with requirePermission(...) on every
 * workspace route; the client only hides what a role may not do.
 */
export const ROLES = ['owner', 'staff'] as const;
export type Role = (typeof ROLES)[number];

export const PERMISSIONS = [
  'studio:read', // see the workspace
  'studio:settings', // branding, currency, units, contact
  'team:manage', // invites, roles, removals
  'catalog:read',
  'catalog:write', // blanks, sizes, prices, materials, machines, recipes
  'order:read',
  'order:review', // photo review, ask for a new photo
  'order:produce', // prep, proofs, render, mark burned and shipped
  'order:refund', // refunds and cancellations
  'audit:read', // the audit log of sensitive actions
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const STAFF: readonly Permission[] = ['studio:read', 'catalog:read', 'order:read', 'order:review', 'order:produce'];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  owner: PERMISSIONS,
  staff: STAFF,
};

/** Whether a member with this role may do this. */
export function can(role: Role | undefined | null, permission: Permission): boolean {
  return role ? ROLE_PERMISSIONS[role].includes(permission) : false;
}

/** How people read each role, wherever it is shown: the workspace header, Team, invitations. */
export const ROLE_LABELS: Record<Role, string> = { owner: 'Owner', staff: 'Team member' };
