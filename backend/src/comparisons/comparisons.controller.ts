import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { download } from '../common/files.js';
import { ApiRefusal, ApiInvalid, ApiRecord, ApiSignature, ApiSignedIn } from '../common/openapi/api-responses.js';
import { CreateAssessmentDto } from './dto/assessment.dto.js';
import { CompareVersionsQueryDto } from './dto/compare-query.dto.js';
import { MethodTrendDto, VersionComparisonDto } from './dto/comparison.dto.js';
import { ComparisonsService } from './comparisons.service.js';

@ApiTags('comparisons')
@ApiSignedIn('Quality managers and reviewers only.')
@Roles(Role.QualityManager, Role.Reviewer)
@Controller()
export class ComparisonsController {
  constructor(private readonly comparisons: ComparisonsService) {}

  @Get('method-versions/compare')
  @ApiOkResponse({
    type: VersionComparisonDto,
    description: 'Two versions of one method compared through their studies; a version without an approved study is named in `missing`.',
  })
  @ApiInvalid('Unknown version or study, versions of two methods, the same version twice, a margin not above 0: the field is named.')
  compare(@Query() query: CompareVersionsQueryDto): Promise<VersionComparisonDto> {
    return this.comparisons.compare(query);
  }

  @Get('methods/:id/trend')
  @ApiOkResponse({ type: MethodTrendDto })
  @ApiRecord('method')
  trend(@Param('id', ParseUUIDPipe) id: string): Promise<MethodTrendDto> {
    return this.comparisons.trend(id);
  }

  @Post('method-versions/:id/assessment')
  @HttpCode(201)
  @Roles(Role.QualityManager)
  @ApiProduces('application/pdf')
  @ApiCreatedResponse({
    description:
      'The signed change assessment (PDF), stored against this version and verifiable on the verify page; its id in X-Assessment-Id.',
    schema: { type: 'string', format: 'binary' },
  })
  @ApiRefusal(403, 'Quality managers only.')
  @ApiSignature('method version')
  async assess(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: CreateAssessmentDto,
    @CurrentUser() actor: AuthUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const file = await this.comparisons.assess(id, dto, actor);
    res.setHeader('X-Assessment-Id', file.id);
    return download(res, file.pdf, 'application/pdf', file.fileName);
  }
}
