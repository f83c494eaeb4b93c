import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Role, type RunDto, type RunMethodChoiceDto, type RunPageDto, type RunPreviewDto, type RunReviewDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { SigningStep } from '../common/decorators/signing-step.decorator.js';
import { download } from '../common/files.js';
import { ApiConflict, ApiRefusal, ApiFile, ApiInvalid, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import {
  MethodChoiceResponseDto,
  RunPageResponseDto,
  RunPreviewResponseDto,
  RunResponseDto,
  RunReviewResponseDto,
} from './dto/run-response.dto.js';
import { CreateRunDto } from './dto/create-run.dto.js';
import { ExportRunQueryDto } from './dto/export-run.query.dto.js';
import { ListRunsQueryDto } from './dto/list-runs.query.dto.js';
import { ReturnRunDto, SignRunDto, SupersedeRunDto } from './dto/run-signing.dto.js';
import { RunReleaseService } from './run-release.service.js';
import { RunReportService } from './run-report.service.js';
import { RunsService, type RunFile } from './runs.service.js';

const send = (res: Response, file: RunFile): StreamableFile => download(res, file.body, file.contentType, file.filename);

@ApiTags('runs')
@ApiSignedIn()
@Roles(Role.Analyst, Role.Reviewer, Role.QualityManager)
@Controller('runs')
export class RunsController {
  constructor(
    private readonly runsService: RunsService,
    private readonly release: RunReleaseService,
    private readonly reports: RunReportService,
  ) {}

  @Get()
  @ApiOkResponse({ type: RunPageResponseDto })
  @ApiInvalid()
  list(@Query() query: ListRunsQueryDto): Promise<RunPageDto> {
    return this.runsService.list(query);
  }

  /** Methods with their versions, each marked usable for runs or not (and why). */
  @Get('method-choices')
  @ApiOkResponse({ type: [MethodChoiceResponseDto] })
  methodChoices(): Promise<RunMethodChoiceDto[]> {
    return this.runsService.methodChoices();
  }

  @Post()
  @Roles(Role.Analyst)
  @ApiCreatedResponse({ type: RunResponseDto, description: 'The run, calculated and saved.' })
  @ApiInvalid()
  @ApiRefusal(404, 'No such method version.')
  @ApiConflict('The method version may not be used for runs.')
  create(@Body() dto: CreateRunDto, @CurrentUser() actor: AuthUser): Promise<RunDto> {
    return this.runsService.create(dto, actor);
  }

  /** The full result of a run as it would be saved, without saving it. */
  @Post('preview')
  @Roles(Role.Analyst)
  @HttpCode(200)
  @ApiOkResponse({ type: RunPreviewResponseDto })
  @ApiInvalid()
  @ApiRefusal(404, 'No such method version.')
  @ApiConflict('The method version may not be used for runs.')
  preview(@Body() dto: CreateRunDto): Promise<RunPreviewDto> {
    return this.runsService.preview(dto);
  }

  @Get(':id')
  @ApiOkResponse({ type: RunResponseDto })
  @ApiRecord('run')
  findOne(@Param('id', ParseUUIDPipe) id: string): Promise<RunDto> {
    return this.runsService.findOne(id);
  }

  @Get(':id/export')
  @ApiFile('The run’s results as CSV or as a workbook.', 'text/csv', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet')
  @ApiRecord('run')
  @ApiInvalid()
  @ApiConflict('Only a released, accepted run that is not replaced is reported.')
  async export(
    @Param('id', ParseUUIDPipe) id: string,
    @Query() query: ExportRunQueryDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    await this.release.assertReportable(id);
    return send(res, await this.runsService.exportFile(id, query.format));
  }

  /** The signed results report of a released, accepted run (issued once, then always the same bytes). */
  @Get(':id/report')
  @ApiFile('The signed results report.', 'application/pdf')
  @ApiRecord('run')
  @ApiConflict('Only a released, accepted run that is not replaced is reported.')
  async report(
    @Param('id', ParseUUIDPipe) id: string,
    @CurrentUser() actor: AuthUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return send(res, await this.reports.reportFile(id, actor));
  }

  /** Where the run stands in its release, with its signatures. */
  @Get(':id/review')
  @ApiOkResponse({ type: RunReviewResponseDto })
  @ApiRecord('run')
  review(@Param('id', ParseUUIDPipe) id: string): Promise<RunReviewDto> {
    return this.release.review(id);
  }

  /** The analyst signs the run as performed and submits it for release. */
  @SigningStep(':id/submit', 'run', RunReviewResponseDto, [Role.Analyst])
  submit(@Param('id', ParseUUIDPipe) id: string, @Body() dto: SignRunDto, @CurrentUser() actor: AuthUser): Promise<RunReviewDto> {
    return this.release.submit(id, dto, actor);
  }

  /** A second person signs the run as reviewed and released. */
  @SigningStep(':id/release', 'run', RunReviewResponseDto, [Role.Reviewer])
  releaseRun(@Param('id', ParseUUIDPipe) id: string, @Body() dto: SignRunDto, @CurrentUser() actor: AuthUser): Promise<RunReviewDto> {
    return this.release.release(id, dto, actor);
  }

  @SigningStep(':id/return', 'run', RunReviewResponseDto, [Role.Reviewer])
  returnRun(@Param('id', ParseUUIDPipe) id: string, @Body() dto: ReturnRunDto, @CurrentUser() actor: AuthUser): Promise<RunReviewDto> {
    return this.release.returnToAnalyst(id, dto, actor);
  }

  /** A correction run replacing a released one. */
  @Post(':id/supersede')
  @Roles(Role.Analyst)
  @ApiCreatedResponse({ type: RunResponseDto, description: 'The correction run; the released one is marked replaced.' })
  @ApiRecord('run')
  @ApiInvalid()
  @ApiConflict('Only a released run that is not already replaced can be corrected.')
  supersede(@Param('id', ParseUUIDPipe) id: string, @Body() dto: SupersedeRunDto, @CurrentUser() actor: AuthUser): Promise<RunDto> {
    return this.release.supersede(id, dto, actor);
  }

  @Get(':id/sheet')
  @ApiFile('The run sheet: the run’s data and results to print.', 'application/pdf')
  @ApiRecord('run')
  async sheet(@Param('id', ParseUUIDPipe) id: string, @Res({ passthrough: true }) res: Response): Promise<StreamableFile> {
    return send(res, await this.runsService.sheet(id));
  }
}
