import {
  BadRequestException,
  Controller,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Post,
  Res,
  StreamableFile,
  UploadedFile,
} from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Throttle } from '@nestjs/throttler';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { download, FileUpload } from '../common/files.js';
import { ApiConflict, ApiRefusal, ApiFile, ApiRecord, ApiSignedIn, ApiThrottled } from '../common/openapi/api-responses.js';
import { ReportVerificationDto } from './dto/report-verification.dto.js';
import { MAX_REPORT_BYTES, type ReportVerification } from '@meritline/shared';
import { ReportsService } from './reports.service.js';

@ApiTags('reports')
@Controller()
export class ReportsController {
  constructor(private readonly reports: ReportsService) {}

  @Get('studies/:id/report')
  @ApiSignedIn()
  @ApiFile('The signed report of an approved study (always the same bytes), or an unsigned draft preview.', 'application/pdf')
  @ApiRecord('study')
  @ApiConflict('Only an approved study gets a signed report.')
  async download(
    @Param('id', ParseUUIDPipe) id: string,
    @CurrentUser() user: AuthUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const file = await this.reports.reportFile(id, user);
    return download(res, file.pdf, 'application/pdf', file.fileName);
  }

  @Public()
  @Post('reports/verify')
  @HttpCode(200)
  @Throttle({ default: { limit: 30, ttl: 60_000 } })
  @FileUpload(MAX_REPORT_BYTES, 'The PDF to check (at most 20 MB).')
  @ApiOkResponse({ type: ReportVerificationDto })
  @ApiRefusal(400, 'No file attached as the form field "file".')
  @ApiThrottled()
  verify(@UploadedFile() file: Express.Multer.File | undefined): Promise<ReportVerification> {
    if (!file) throw new BadRequestException('Attach the PDF to check as the form field "file".');
    return this.reports.verify(file.buffer);
  }
}
