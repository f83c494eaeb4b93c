import { Controller, Get } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { OverviewDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { ApiSignedIn } from '../common/openapi/api-responses.js';
import { OverviewResponseDto } from './dto/overview.dto.js';
import { OverviewService } from './overview.service.js';

@ApiTags('overview')
@ApiSignedIn()
@Controller('overview')
export class OverviewController {
  constructor(private readonly overview: OverviewService) {}

  @Get()
  @ApiOkResponse({ type: OverviewResponseDto })
  get(@CurrentUser() user: AuthUser): Promise<OverviewDto> {
    return this.overview.overviewFor(user);
  }
}
