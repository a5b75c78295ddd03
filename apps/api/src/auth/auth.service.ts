import { BadRequestException, ForbiddenException, Inject, Injectable, Logger, UnauthorizedException } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { InjectRepository } from '@nestjs/typeorm';
import { createHash, randomBytes } from 'node:crypto';
import { DataSource, IsNull, MoreThan, Repository } from 'typeorm';
import { RESET_PASSWORD_PATH } from '@cribra/contracts';
import { appConfig } from '../config/app.config';
import { composeMail } from '../mail/compose-mail';
import { MailService } from '../mail/mail.service';
import { UserEntity } from '../users/user.entity';
import { UsersService } from '../users/users.service';
import { SignUpDto } from './dto/sign-up.dto';
import { INVITATION_GATE, InvitationGate } from './invitation-gate';
import { PasswordResetEntity } from './password-reset.entity';

const RESET_TTL_MS = 60 * 60 * 1000;

export function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

@Injectable()
export class AuthService {
  private readonly logger = new Logger(AuthService.name);

  constructor(
    @Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>,
    private readonly users: UsersService,
    private readonly mail: MailService,
    private readonly db: DataSource,
    @InjectRepository(PasswordResetEntity) private readonly resets: Repository<PasswordResetEntity>,
    @Inject(INVITATION_GATE) private readonly invitations: InvitationGate,
  ) {}

  async signUp(dto: SignUpDto): Promise<UserEntity> {
    const token = dto.invitationToken?.trim() || undefined;
    if (this.cfg.signupMode === 'invite' && !token) {
      throw new ForbiddenException('Sign-up is by invitation only on this server');
    }
    if (token) await this.invitations.check(dto.email, token);
    const user = await this.users.create(dto);
    if (token) await this.invitations.accept(user, token);
    return user;
  }

  /** Also ends the account's other sessions (`keepSessionId`: the one making the change stays). */
  async changePassword(user: UserEntity, currentPassword: string, newPassword: string, keepSessionId?: string): Promise<void> {
    const ok = await this.users.checkCredentials(user.email, currentPassword);
    if (!ok) throw new UnauthorizedException('The current password is wrong');
    await this.users.setPassword(user.id, newPassword);
    // Whoever signed in with the old password elsewhere is signed out.
    await this.db.query(`DELETE FROM session WHERE sess->>'userId' = $1 AND sid IS DISTINCT FROM $2`, [user.id, keepSessionId ?? null]);
    await this.voidResets(user.id);
  }

  /** Voids every unused reset link of the account (a newer link, a used one or a password change supersedes them). */
  private async voidResets(userId: string): Promise<void> {
    await this.db.query(`UPDATE password_resets SET used_at = now() WHERE user_id = $1 AND used_at IS NULL`, [userId]);
  }

  /** Mails a single-use link valid for one hour; silent for unknown addresses (no account probing). */
  async requestReset(email: string): Promise<void> {
    const user = await this.users.findByEmail(email);
    if (!user) return;
    // Only the newest link works: issuing one voids the older ones.
    await this.voidResets(user.id);
    const token = randomBytes(32).toString('base64url');
    await this.resets.insert({
      userId: user.id,
      tokenHash: sha256Hex(token),
      expiresAt: new Date(Date.now() + RESET_TTL_MS),
    });
    const link = `${this.cfg.publicUrl}${RESET_PASSWORD_PATH}?token=${token}`;
    try {
      const body = composeMail({
        greeting: `Hello ${user.displayName},`,
        intro: ['Someone (hopefully you) asked to reset the password of your Cribra account. Open this link within one hour to choose a new password.'],
        link: { href: link, label: 'Choose a new password' },
        outro: ['The link works once. If you did not ask for it, ignore this message; your password stays as it is.'],
      });
      await this.mail.send({ to: user.email, subject: 'Reset your Cribra password', ...body });
    } catch (err) {
      this.logger.error(`Could not send the reset mail: ${(err as Error).message}`);
    }
  }

  /** @throws BadRequestException when the token is unknown, used or expired. */
  async confirmReset(token: string, newPassword: string): Promise<void> {
    const tokenHash = sha256Hex(token);
    const row = await this.resets.findOne({ where: { tokenHash, usedAt: IsNull(), expiresAt: MoreThan(new Date()) } });
    if (!row) throw new BadRequestException('This reset link is invalid, already used or expired; ask for a new one');
    // Claim the token atomically so two concurrent confirmations cannot both succeed.
    const claimed = await this.resets
      .createQueryBuilder()
      .update()
      .set({ usedAt: () => 'now()' })
      .where('id = :id AND used_at IS NULL', { id: row.id })
      .execute();
    if (!claimed.affected) throw new BadRequestException('This reset link is invalid, already used or expired; ask for a new one');
    await this.users.setPassword(row.userId, newPassword);
    await this.voidResets(row.userId);
    // Sign the account out everywhere: whoever knew the old password loses their sessions.
    await this.db.query(`DELETE FROM session WHERE sess->>'userId' = $1`, [row.userId]);
  }
}
