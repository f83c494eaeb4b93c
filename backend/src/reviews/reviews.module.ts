import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuthModule } from '../auth/auth.module.js';
import { MailModule } from '../mail/mail.module.js';
import { NotificationsModule } from '../notifications/notifications.module.js';
import { ReportsModule } from '../reports/reports.module.js';
import { RunsModule } from '../runs/runs.module.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { UsersModule } from '../users/users.module.js';
import { CommentsService } from './comments.service.js';
import { ReviewNoticesService } from './review-notices.service.js';
import { ReviewQueueController, StudyReviewController } from './reviews.controller.js';
import { ReviewsService } from './reviews.service.js';
import { StudyComment } from './study-comment.entity.js';
import { StudyHistoryService } from './study-history.service.js';
import { StudySignature } from './study-signature.entity.js';

@Module({
  imports: [
    TypeOrmModule.forFeature([ValidationStudy, StudySignature, StudyComment]),
    AuthModule,
    UsersModule,
    MailModule,
    NotificationsModule,
    ReportsModule,
    RunsModule,
  ],
  controllers: [StudyReviewController, ReviewQueueController],
  providers: [ReviewsService, CommentsService, StudyHistoryService, ReviewNoticesService],
  exports: [ReviewsService],
})
export class ReviewsModule {}
