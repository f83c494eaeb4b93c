import { Module } from '@nestjs/common';
import { AuthModule } from '../auth/auth.module.js';
import { ReportsModule } from '../reports/reports.module.js';
import { AuditReviewController } from './audit-review.controller.js';
import { AuditTrailService } from './audit-trail.service.js';

@Module({
  imports: [AuthModule, ReportsModule],
  controllers: [AuditReviewController],
  providers: [AuditTrailService],
  exports: [AuditTrailService],
})
export class AuditReviewModule {}
