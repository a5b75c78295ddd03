import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { CSRF_HEADER } from '@cribra/contracts';

export const CSRF_COOKIE = 'cribra.csrf';
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Signed double-submit: the token is `nonce.hmac(secret, nonce)`, sent as an httpOnly cookie and
 * returned in the body of GET /api/auth/csrf; state-changing requests must echo it in the header.
 * A cross-site page can make the browser send the cookie but cannot read the token to set the header.
 */
export class Csrf {
  constructor(private readonly secret: string) {}

  private sign(nonce: string): string {
    return createHmac('sha256', this.secret).update(`csrf:${nonce}`).digest('base64url');
  }

  private valid(token: string | undefined): boolean {
    if (!token) return false;
    const [nonce, mac] = token.split('.');
    if (!nonce || !mac) return false;
    const expected = Buffer.from(this.sign(nonce));
    const given = Buffer.from(mac);
    return expected.length === given.length && timingSafeEqual(expected, given);
  }

  /** Returns the request's current token when valid, else a new one; (re)sets the cookie. */
  issue(req: Request, res: Response): string {
    const existing = readCookie(req, CSRF_COOKIE);
    const token = this.valid(existing) ? existing! : (() => {
      const nonce = randomBytes(18).toString('base64url');
      return `${nonce}.${this.sign(nonce)}`;
    })();
    res.cookie(CSRF_COOKIE, token, { httpOnly: true, sameSite: 'lax', path: '/' });
    return token;
  }

  /** Express middleware refusing state-changing /api requests without a matching header (403). */
  middleware(): RequestHandler {
    return (req: Request, res: Response, next: NextFunction) => {
      if (SAFE.has(req.method)) return next();
      const header = req.get(CSRF_HEADER);
      const cookie = readCookie(req, CSRF_COOKIE);
      if (!header || !cookie || header !== cookie || !this.valid(cookie)) {
        res.status(403).json({
          statusCode: 403,
          error: 'Forbidden',
          message: `Missing or invalid CSRF token: fetch GET /api/auth/csrf and send it in the ${CSRF_HEADER} header`,
        });
        return;
      }
      next();
    };
  }
}

function readCookie(req: Request, name: string): string | undefined {
  const header = req.headers.cookie;
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const i = part.indexOf('=');
    if (i < 0) continue;
    if (part.slice(0, i).trim() === name) return decodeURIComponent(part.slice(i + 1).trim());
  }
  return undefined;
}
