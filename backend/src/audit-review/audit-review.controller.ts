import { Body, Controller, Get, HttpCode, Inject, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Role, type AuditPersonDto, type AuditReviewDto, type AuditTrailPageDto, type AuditVerificationDto } from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { download } from '../common/files.js';
import { ApiRefusal, ApiFile, ApiInvalid, ApiPasswordRefused, ApiSignedIn } from '../common/openapi/api-responses.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { LabCertificateService } from '../reports/signing/lab-certificate.service.js';
import { auditExtractCsv, auditExtractFileName, renderAuditExtract } from './audit-extract.document.js';
import { AuditTrailService, isQualityOversight, toEntryDto } from './audit-trail.service.js';
import { AuditExportQueryDto, AuditTrailQueryDto } from './dto/audit-trail-query.dto.js';
import {
  AuditPersonResponseDto,
  AuditReviewResponseDto,
  AuditTrailPageResponseDto,
  AuditVerificationResponseDto,
} from './dto/audit-response.dto.js';
import { CreateAuditReviewDto } from './dto/create-audit-review.dto.js';

@ApiTags('audit')
@ApiSignedIn('Outside the reader’s records, or a role that may not do this.')
@Controller('audit')
export class AuditReviewController {
  constructor(
    private readonly trail: AuditTrailService,
    private readonly audit: AuditService,
    private readonly certificate: LabCertificateService,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
  ) {}

  @Get()
  @ApiOkResponse({ type: AuditTrailPageResponseDto })
  @ApiInvalid()
  @ApiRefusal(404, 'The record filtered on does not exist.')
  list(@Query() query: AuditTrailQueryDto, @CurrentUser() user: AuthUser): Promise<AuditTrailPageDto> {
    return this.trail.page(query, user);
  }

  @Get('people')
  @ApiOkResponse({ type: [AuditPersonResponseDto] })
  people(@CurrentUser() user: AuthUser): Promise<AuditPersonDto[]> {
    return this.trail.people(user);
  }

  @Get('verify')
  @Roles(Role.QualityManager, Role.Admin)
  @ApiOkResponse({ type: AuditVerificationResponseDto })
  verify(): Promise<AuditVerificationDto> {
    return this.audit.verify();
  }

  @Get('export')
  @ApiFile('The entries as CSV, or as a signed PDF extract.', 'text/csv', 'application/pdf')
  @ApiInvalid()
  @ApiRefusal(404, 'The record filtered on does not exist.')
  async export(
    @Query() query: AuditExportQueryDto,
    @CurrentUser() user: AuthUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const rows = await this.trail.entriesForExport(query, user);
    const names = await this.trail.namesOf(rows);
    const entries = rows.map((entry) => toEntryDto(entry, names));
    const exportedAt = new Date();
    const extract = {
      laboratoryName: this.config.laboratoryName,
      exportedAt,
      exportedBy: user.name,
      filters: await this.trail.describeFilters(query),
      entries,
      verification: isQualityOversight(user) ? await this.audit.verify() : null,
    };
    const file =
      query.format === 'csv'
        ? Buffer.from(auditExtractCsv(extract), 'utf8')
        : await this.certificate.sign(await renderAuditExtract(extract), {
            reason: `Audit-trail extract of ${entries.length} entries, exported by ${user.name}`,
            location: this.config.laboratoryName,
            contactInfo: `${this.config.publicUrl}/verify`,
            signingTime: exportedAt,
          });
    const type = query.format === 'csv' ? 'text/csv; charset=utf-8' : 'application/pdf';
    return download(res, file, type, auditExtractFileName(exportedAt, query.format));
  }

  @Get('reviews')
  @ApiOkResponse({ type: [AuditReviewResponseDto] })
  reviews(): Promise<AuditReviewDto[]> {
    return this.trail.reviews();
  }

  @Post('reviews')
  @HttpCode(201)
  @Roles(Role.QualityManager)
  @ApiCreatedResponse({ type: AuditReviewResponseDto })
  @ApiPasswordRefused()
  @ApiInvalid()
  review(@Body() dto: CreateAuditReviewDto, @CurrentUser() user: AuthUser): Promise<AuditReviewDto> {
    return this.trail.review(dto, user);
  }
}
