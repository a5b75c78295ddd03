import type { Request } from 'express';

declare module 'express-session' {
  interface SessionData {
    /** Id of the signed-in user; the user row itself is loaded per request. */
    userId?: string;
  }
}

export const SESSION_COOKIE = 'cribra.sid';

/** Signs the user in on a NEW session id (guards against session fixation). */
export function startSession(req: Request, userId: string): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.session.userId = userId;
      req.session.save((e) => (e ? reject(e) : resolve()));
    });
  });
}

/** Removes the session row; the cookie is cleared by the caller. */
export function endSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    if (!req.session) return resolve();
    req.session.destroy((err) => (err ? reject(err) : resolve()));
  });
}
