import type { UserView } from '@cribra/contracts';
import type { UserEntity } from './user.entity';

/** The only shape in which a user leaves the API (never the password hash). */
export function toUserView(u: UserEntity): UserView {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    siteRole: u.siteRole,
    createdAt: u.createdAt.toISOString(),
  };
}
