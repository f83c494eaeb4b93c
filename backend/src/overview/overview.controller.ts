import { Controller, Get } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { OverviewDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { OverviewService } from './overview.service.js';

@ApiTags('overview')
@ApiBearerAuth()
@Controller('overview')
export class OverviewController {
  constructor(private readonly overview: OverviewService) {}

  @Get()
  get(@CurrentUser() user: AuthUser): Promise<OverviewDto> {
    return this.overview.overviewFor(user);
  }
}
