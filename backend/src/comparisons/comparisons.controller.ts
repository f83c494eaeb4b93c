import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, Res, StreamableFile } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiForbiddenResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiProduces,
  ApiTags,
  ApiUnauthorizedResponse,
  ApiUnprocessableEntityResponse,
} from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CreateAssessmentDto } from './dto/assessment.dto.js';
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

  @Post('method-versions/:id/assessment')
  @HttpCode(201)
  @Roles(Role.QualityManager)
  @ApiProduces('application/pdf')
  @ApiCreatedResponse({
    description:
      'The signed change assessment (PDF), stored against this version and verifiable on the verify page; its id in X-Assessment-Id.',
    schema: { type: 'string', format: 'binary' },
  })
  @ApiUnauthorizedResponse({ type: ApiErrorDto, description: 'Not signed in, or the password is not correct (nothing is signed).' })
  @ApiForbiddenResponse({ type: ApiErrorDto, description: 'Quality managers only.' })
  @ApiNotFoundResponse({ type: ApiErrorDto, description: 'No such version.' })
  @ApiConflictResponse({ type: ApiErrorDto, description: 'The version changed since the signer loaded it (stale lockVersion).' })
  @ApiUnprocessableEntityResponse({
    type: ApiErrorDto,
    description: 'Statement too short, no password, or no earlier version to compare with: the field is named.',
  })
  async assess(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: CreateAssessmentDto,
    @CurrentUser() actor: AuthUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const file = await this.comparisons.assess(id, dto, actor);
    res.setHeader('X-Assessment-Id', file.id);
    res.setHeader('Cache-Control', 'private, no-store');
    return new StreamableFile(file.pdf, {
      type: 'application/pdf',
      disposition: `attachment; filename="${file.fileName}"`,
      length: file.pdf.length,
    });
  }
}
