import { Module } from '@nestjs/common';
import { ReportsController } from './reports.controller.js';
import { ReportsService } from './reports.service.js';
import { LabCertificateService } from './signing/lab-certificate.service.js';

@Module({
  controllers: [ReportsController],
  providers: [ReportsService, LabCertificateService],
  exports: [ReportsService, LabCertificateService],
})
export class ReportsModule {}
