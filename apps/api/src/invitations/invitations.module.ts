import { Module } from '@nestjs/common';
import { MailModule } from '../mail/mail.module';
import { MembersModule } from '../members/members.module';
import { InvitationsController } from './invitations.controller';
import { InvitationsService } from './invitations.service';

/** E-mail invitations; also provides AuthModule's invitation gate (sign-up with a token). */
@Module({
  imports: [MailModule, MembersModule],
  controllers: [InvitationsController],
  providers: [InvitationsService],
  exports: [InvitationsService],
})
export class InvitationsModule {}
