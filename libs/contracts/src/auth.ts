/** Site-wide role: admins manage users and roles; members do everything else. */
export type SiteRole = 'admin' | 'member';

export interface UserView {
  id: string;
  email: string;
  displayName: string;
  siteRole: SiteRole;
  createdAt: string;
}

/*
 * Auth routes (all under /api; state-changing ones need the CSRF header):
 *   GET  /api/auth/csrf                 → { token }            (sets the CSRF cookie too)
 *   POST /api/auth/signup   SignUpBody  → 201 UserView         (403 when sign-up is invitation-only)
 *   POST /api/auth/signin   SignInBody  → 200 UserView         (401 wrong credentials, 429 rate limit)
 *   POST /api/auth/signout              → 204
 *   GET  /api/auth/me                   → 200 UserView | 401
 *   PATCH /api/auth/me     UpdateProfileBody → 200 UserView
 *   POST /api/auth/password ChangePasswordBody → 204
 *   POST /api/auth/reset/request ResetRequestBody → 202 (always, whether or not the address exists)
 *   POST /api/auth/reset/confirm ResetConfirmBody → 204
 *   GET  /api/admin/users               → UserView[]           (admin only)
 *   PATCH /api/admin/users/:id  { siteRole } → UserView        (admin only)
 *   GET  /api/health                    → { status: 'ok', database: 'up' }
 */
export const CSRF_HEADER = 'x-csrf-token';

/** Shortest password the API accepts (sign-up, change, reset). */
export const MIN_PASSWORD_LENGTH = 8;
/**
 * Web page the reset e-mail links to: `${PUBLIC_URL}${RESET_PASSWORD_PATH}?token=<token>`;
 * the page posts the token with the new password to /api/auth/reset/confirm.
 */
export const RESET_PASSWORD_PATH = '/reset-password';

export interface SignUpBody {
  email: string;
  password: string;
  displayName: string;
  invitationToken?: string;
}
export interface SignInBody {
  email: string;
  password: string;
}
export interface UpdateProfileBody {
  displayName: string;
}
export interface ChangePasswordBody {
  currentPassword: string;
  newPassword: string;
}
export interface ResetRequestBody {
  email: string;
}
export interface ResetConfirmBody {
  token: string;
  newPassword: string;
}
