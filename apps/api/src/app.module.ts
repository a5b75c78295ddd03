import { Module } from '@nestjs/common';
import { ConfigModule, ConfigType } from '@nestjs/config';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AdminModule } from './admin/admin.module';
import { AuthModule } from './auth/auth.module';
import { SessionStoreService } from './auth/session-store.service';
import { CommonModule } from './common/common.module';
import { appConfig } from './config/app.config';
import { makeDataSourceOptions } from './database/data-source';
import { HealthModule } from './health/health.module';
import { MailModule } from './mail/mail.module';
import { UsersModule } from './users/users.module';
import { AuditModule } from './audit/audit.module';
import { MembersModule } from './members/members.module';
import { NotebooksModule } from './notebooks/notebooks.module';
import { CellsModule } from './cells/cells.module';
import { QueueModule } from './queue/queue.module';
import { RunsModule } from './runs/runs.module';
import { LevelsModule } from './levels/levels.module';
import { LedgerModule } from './ledger/ledger.module';
import { UploadsModule } from './uploads/uploads.module';
import { ExportsModule } from './exports/exports.module';
import { InvitationsModule } from './invitations/invitations.module';
import { CommentsModule } from './comments/comments.module';
import { ReviewsModule } from './reviews/reviews.module';
import { LocksModule } from './locks/locks.module';
import { RecordsModule } from './records/records.module';
import { PresenceModule } from './presence/presence.module';

@Module({
  imports: [
    ConfigModule.forRoot({ isGlobal: true, ignoreEnvFile: true, load: [appConfig] }),
    TypeOrmModule.forRootAsync({
      inject: [appConfig.KEY],
      useFactory: (cfg: ConfigType<typeof appConfig>) => makeDataSourceOptions(cfg.databaseUrl),
    }),
    CommonModule,
    MailModule,
    UsersModule,
    AuthModule,
    AdminModule,
    HealthModule,
    // Feature modules (notebooks, runs, …) are added below this line.
    AuditModule,
    MembersModule,
    NotebooksModule,
    CellsModule,
    QueueModule,
    RunsModule,
    LevelsModule,
    LedgerModule,
    UploadsModule,
    ExportsModule,
    InvitationsModule,
    CommentsModule,
    ReviewsModule,
    LocksModule,
    RecordsModule,
    PresenceModule,
  ],
  providers: [SessionStoreService],
})
export class AppModule {}
