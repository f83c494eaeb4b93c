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
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBody, ApiConsumes, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Throttle } from '@nestjs/throttler';
import type { Response } from 'express';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { ApiConflict, ApiError, ApiFile, ApiRecord, ApiSignedIn, ApiThrottled } from '../common/openapi/api-responses.js';
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
    res.setHeader('Cache-Control', 'private, no-store');
    return new StreamableFile(file.pdf, {
      type: 'application/pdf',
      disposition: `attachment; filename="${file.fileName}"`,
      length: file.pdf.length,
    });
  }

  @Public()
  @Post('reports/verify')
  @HttpCode(200)
  @Throttle({ default: { limit: 30, ttl: 60_000 } })
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: MAX_REPORT_BYTES, files: 1 } }))
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary', description: 'The PDF to check (at most 20 MB).' } },
    },
  })
  @ApiOkResponse({ type: ReportVerificationDto })
  @ApiError(400, 'No file attached as the form field "file".')
  @ApiError(413, 'The file is larger than 20 MB.')
  @ApiThrottled()
  verify(@UploadedFile() file: Express.Multer.File | undefined): Promise<ReportVerification> {
    if (!file) throw new BadRequestException('Attach the PDF to check as the form field "file".');
    return this.reports.verify(file.buffer);
  }
}
