import { Global, Module } from '@nestjs/common';
import { AuditService } from './audit.service.js';

/** Recording and verifying the trail; reading it lives in the audit-review module. */
@Global()
@Module({
  providers: [AuditService],
  exports: [AuditService],
})
export class AuditModule {}
