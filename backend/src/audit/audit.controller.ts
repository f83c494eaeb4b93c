import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import { Roles } from '../common/decorators/roles.decorator.js';
import { AuditQueryDto } from './dto/audit-query.dto.js';
import { AuditService } from './audit.service.js';

@ApiTags('audit')
@ApiBearerAuth()
@Controller('audit')
export class AuditController {
  constructor(private readonly auditService: AuditService) {}

  @Get()
  list(@Query() query: AuditQueryDto) {
    return this.auditService.list({ entity: query.entity, entityId: query.id, limit: query.limit });
  }

  @Get('verify')
  @Roles(Role.QualityManager, Role.Admin)
  verify() {
    return this.auditService.verify();
  }
}
