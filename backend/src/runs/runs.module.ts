import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuthModule } from '../auth/auth.module.js';
import { MailModule } from '../mail/mail.module.js';
import { NotificationsModule } from '../notifications/notifications.module.js';
import { ReportsModule } from '../reports/reports.module.js';
import { UsersModule } from '../users/users.module.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { User } from '../users/user.entity.js';
import { MethodVersionRunsController } from './method-version-runs.controller.js';
import { RunReleaseService } from './run-release.service.js';
import { RunReportService } from './run-report.service.js';
import { QcTrendsController } from './qc-trends.controller.js';
import { QcTrendsService } from './qc-trends.service.js';
import { InstrumentImportService } from './instrument-import.service.js';
import { RunSignature } from './run-signature.entity.js';
import { Run } from './run.entity.js';
import { RunsController } from './runs.controller.js';
import { RunsService } from './runs.service.js';

@Module({
  imports: [
    TypeOrmModule.forFeature([Run, RunSignature, MethodVersion, ValidationStudy, User]),
    AuthModule,
    UsersModule,
    MailModule,
    NotificationsModule,
    ReportsModule,
  ],
  controllers: [RunsController, MethodVersionRunsController, QcTrendsController],
  providers: [RunsService, RunReleaseService, RunReportService, QcTrendsService, InstrumentImportService],
  exports: [RunReleaseService],
})
export class RunsModule {}
