import { Controller, Get, Param, ParseUUIDPipe, Query } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiForbiddenResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiTags,
  ApiUnauthorizedResponse,
  ApiUnprocessableEntityResponse,
} from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CompareVersionsQueryDto } from './dto/compare-query.dto.js';
import { ApiErrorDto, MethodTrendDto, VersionComparisonDto } from './dto/comparison.dto.js';
import { ComparisonsService } from './comparisons.service.js';

@ApiTags('comparisons')
@ApiBearerAuth()
@ApiUnauthorizedResponse({ type: ApiErrorDto, description: 'Not signed in.' })
@ApiForbiddenResponse({ type: ApiErrorDto, description: 'Quality managers and reviewers only.' })
@Roles(Role.QualityManager, Role.Reviewer)
@Controller()
export class ComparisonsController {
  constructor(private readonly comparisons: ComparisonsService) {}

  @Get('method-versions/compare')
  @ApiOkResponse({
    type: VersionComparisonDto,
    description: 'Two versions of one method compared through their studies; a version without an approved study is named in `missing`.',
  })
  @ApiUnprocessableEntityResponse({
    type: ApiErrorDto,
    description: 'Unknown version or study, versions of two methods, the same version twice, a margin not above 0: the field is named.',
  })
  compare(@Query() query: CompareVersionsQueryDto): Promise<VersionComparisonDto> {
    return this.comparisons.compare(query);
  }

  @Get('methods/:id/trend')
  @ApiOkResponse({ type: MethodTrendDto })
  @ApiNotFoundResponse({ type: ApiErrorDto, description: 'No such method.' })
  trend(@Param('id', ParseUUIDPipe) id: string): Promise<MethodTrendDto> {
    return this.comparisons.trend(id);
  }
}
