import type { User } from '../features/accounts/user.entity.ts';
import type { Studio } from '../features/studios/studio.entity.ts';
import type { Role } from '#shared/permissions.ts';

declare global {
  namespace Express {
    interface Request {
      /** The signed-in user, set by requireUser. */
      user?: User;
      /** The studio of a workspace route and the user's role in it, set by studioContext. */
      studio?: Studio;
      role?: Role;
    }
  }
}
