import { z } from 'zod';
import { emailSchema, passwordSchema, personNameSchema, roleSchema } from './accounts.ts';

export const memberSchema = z.object({
  id: z.uuid(),
  userId: z.uuid(),
  email: z.string(),
  name: z.string().nullable(),
  role: roleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const inviteSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  role: roleSchema,
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type Invite = z.infer<typeof inviteSchema>;

export const teamSchema = z.object({ members: z.array(memberSchema), invites: z.array(inviteSchema) });
export type Team = z.infer<typeof teamSchema>;

export const createInviteInputSchema = z.object({ email: emailSchema, role: roleSchema });
export type CreateInviteInput = z.infer<typeof createInviteInputSchema>;

export const changeRoleInputSchema = z.object({ role: roleSchema });

/** What the invite page shows before the invitee acts. */
export const invitePreviewSchema = z.object({
  studioName: z.string(),
  studioSlug: z.string(),
  email: z.string(),
  role: roleSchema,
  status: z.enum(['open', 'used', 'expired', 'revoked']),
  hasAccount: z.boolean(),
});
export type InvitePreview = z.infer<typeof invitePreviewSchema>;

/** An invitee without an account creates one while accepting. */
export const acceptWithAccountInputSchema = z.object({ name: personNameSchema, password: passwordSchema });
