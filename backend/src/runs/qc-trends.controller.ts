import { Body, Controller, Get, Param, ParseUUIDPipe, Put, Query } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Role, type QcBaselineDto, type QcTrendsDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { ApiChange, ApiInvalid, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { QcBaselineResponseDto, QcTrendsResponseDto } from './dto/run-response.dto.js';
import { PutQcBaselineDto, QcTrendsQueryDto } from './dto/qc-trends.dto.js';
import { QcTrendsService } from './qc-trends.service.js';

@ApiTags('runs')
@ApiSignedIn()
@Roles(Role.Analyst, Role.Reviewer, Role.QualityManager)
@Controller()
export class QcTrendsController {
  constructor(private readonly trends: QcTrendsService) {}

  /** A control chart across runs: check or QC recovery, blank reading, slope or intercept, with the run rules' signals. */
  @Get('methods/:id/qc-trends')
  @ApiOkResponse({ type: QcTrendsResponseDto })
  @ApiRecord('method')
  @ApiInvalid()
  get(@Param('id', ParseUUIDPipe) id: string, @Query() query: QcTrendsQueryDto): Promise<QcTrendsDto> {
    return this.trends.trends(id, query.series, query.versionId);
  }

  /** The released runs whose values set the control limits of a method version. */
  @Put('method-versions/:id/qc-baseline')
  @Roles(Role.QualityManager)
  @ApiOkResponse({ type: QcBaselineResponseDto })
  @ApiChange('method version')
  putBaseline(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: PutQcBaselineDto,
    @CurrentUser() actor: AuthUser,
  ): Promise<QcBaselineDto> {
    return this.trends.putBaseline(id, dto, actor);
  }
}
