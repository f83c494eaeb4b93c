import { Module } from '@nestjs/common';
import { ReportsModule } from '../reports/reports.module.js';
import { QualificationController } from './qualification.controller.js';
import { QualificationService } from './qualification.service.js';

@Module({
  imports: [ReportsModule],
  controllers: [QualificationController],
  providers: [QualificationService],
})
export class QualificationModule {}
