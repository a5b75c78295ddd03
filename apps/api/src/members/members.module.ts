import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { NotebookEntity } from '../notebooks/notebook.entity';
import { MembersController } from './members.controller';
import { MembersService } from './members.service';
import { NotebookMemberEntity } from './notebook-member.entity';
import { NotebookPolicyService } from './notebook-policy.service';

/** Memberships and the notebook permission policy (exported for every notebook feature). */
@Module({
  imports: [TypeOrmModule.forFeature([NotebookEntity, NotebookMemberEntity])],
  controllers: [MembersController],
  providers: [MembersService, NotebookPolicyService],
  exports: [MembersService, NotebookPolicyService],
})
export class MembersModule {}
