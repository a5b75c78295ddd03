import { Module } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { PassportModule } from '@nestjs/passport';
import { ThrottlerModule } from '@nestjs/throttler';
import { TypeOrmModule } from '@nestjs/typeorm';
import { appConfig } from '../config/app.config';
import { MailModule } from '../mail/mail.module';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { InvitationsModule } from '../invitations/invitations.module';
import { InvitationsService } from '../invitations/invitations.service';
import { INVITATION_GATE } from './invitation-gate';
import { LocalStrategy } from './local.strategy';
import { PasswordResetEntity } from './password-reset.entity';
import { SignInThrottlerGuard } from './sign-in-throttler.guard';

@Module({
  imports: [
    UsersModule,
    MailModule,
    InvitationsModule,
    PassportModule,
    TypeOrmModule.forFeature([PasswordResetEntity]),
    ThrottlerModule.forRootAsync({
      inject: [appConfig.KEY],
      useFactory: (cfg: ConfigType<typeof appConfig>) => ({
        throttlers: [{ name: 'signin', ttl: cfg.signInWindowMs, limit: cfg.signInLimit }],
        errorMessage: 'Too many attempts for this account; wait a minute and try again',
      }),
    }),
  ],
  controllers: [AuthController],
  providers: [
    AuthService,
    LocalStrategy,
    SignInThrottlerGuard,
    // Sign-up with an invitation token: the invitations feature checks and accepts it.
    { provide: INVITATION_GATE, useExisting: InvitationsService },
  ],
  exports: [AuthService],
})
export class AuthModule {}
