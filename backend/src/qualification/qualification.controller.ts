import { Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Res, StreamableFile } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Role, type QualificationRunDetailDto, type QualificationRunDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { download } from '../common/files.js';
import { ApiFile, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { QualificationRunDetailResponseDto, QualificationRunResponseDto } from './dto/qualification-run.dto.js';
import { QualificationService } from './qualification.service.js';

@ApiTags('qualification')
@ApiSignedIn('Quality managers and administrators only.')
@Roles(Role.QualityManager, Role.Admin)
@Controller('qualification')
export class QualificationController {
  constructor(private readonly qualification: QualificationService) {}

  @Post()
  @HttpCode(201)
  @ApiCreatedResponse({ type: QualificationRunDetailResponseDto, description: 'Every check run now, with its signed report stored.' })
  run(@CurrentUser() user: AuthUser): Promise<QualificationRunDetailDto> {
    return this.qualification.run(user);
  }

  @Get()
  @ApiOkResponse({ type: [QualificationRunResponseDto] })
  list(): Promise<QualificationRunDto[]> {
    return this.qualification.list();
  }

  @Get(':id/report')
  @ApiFile('The signed self-qualification report.', 'application/pdf')
  @ApiRecord('self-qualification')
  async report(@Param('id', ParseUUIDPipe) id: string, @Res({ passthrough: true }) res: Response): Promise<StreamableFile> {
    const file = await this.qualification.report(id);
    return download(res, file.pdf, 'application/pdf', file.fileName);
  }
}
