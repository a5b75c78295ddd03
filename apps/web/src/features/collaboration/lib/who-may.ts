import type { MemberRole, SiteRole } from '@cribra/contracts';

// Mirrors rows of the API's permission matrix (docs/permissions.md) for what the panel offers;
// the API still decides every request.
interface Who {
  myRole: MemberRole | null;
  siteRole?: SiteRole;
}

/** `audit.read`: the owner and admins. */
export const canReadHistory = (w: Who) => w.myRole === 'owner' || w.siteRole === 'admin';

/** `lock.check`: every member and admins. */
export const canCheckLock = (w: Who) => w.myRole !== null || w.siteRole === 'admin';
