import type { MemberRole, NotebookStatus, SiteRole } from '@cribra/contracts';

// Mirrors the API's policy table for what the screen offers; the API still decides every request.
interface Who {
  myRole: MemberRole | null;
  status: NotebookStatus;
  siteRole?: SiteRole;
}

const editors: MemberRole[] = ['owner', 'editor'];
const runners: MemberRole[] = ['owner', 'editor', 'reviewer'];

const has = (w: Who, roles: MemberRole[]) => w.siteRole === 'admin' || (w.myRole !== null && roles.includes(w.myRole));

export const canEditCells = (w: Who) => w.status !== 'locked' && has(w, editors);
export const canRun = (w: Who) => w.status !== 'locked' && has(w, runners);
export const isOwner = (w: Who) => w.myRole === 'owner';
