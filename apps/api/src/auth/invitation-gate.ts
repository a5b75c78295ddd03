import { ForbiddenException, Injectable } from '@nestjs/common';
import type { UserEntity } from '../users/user.entity';

/**
 * Hook for invitation-based sign-up. AuthService calls `check` before creating the account whenever
 * a sign-up carries an `invitationToken` (and always refuses a token-less sign-up when
 * SIGNUP_MODE=invite), then `accept` once the user row exists.
 * The invitations feature binds its own implementation in AuthModule:
 * `{ provide: INVITATION_GATE, useExisting: InvitationsService }` (importing its module).
 */
export interface InvitationGate {
  /** @throws an HttpException (403/404/410…) when the token is unknown, used, expired or for another address. */
  check(email: string, token: string): Promise<void>;
  /** Marks the invitation used and applies what it grants (e.g. notebook membership). */
  accept(user: UserEntity, token: string): Promise<void>;
}

export const INVITATION_GATE = Symbol('INVITATION_GATE');

/** Default until invitations exist: every token is refused. */
@Injectable()
export class NoInvitationGate implements InvitationGate {
  async check(): Promise<void> {
    throw new ForbiddenException('This server does not accept invitation tokens yet');
  }

  async accept(): Promise<void> {
    /* nothing to record */
  }
}
