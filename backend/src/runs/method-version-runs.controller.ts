import {
  BadRequestException,
  Body,
  Controller,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Post,
  Put,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiConsumes, ApiTags } from '@nestjs/swagger';
import { Role, type ImportMappingDto, type InstrumentImportResult, type RunControlChartDto, type RunOptionsDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { MAX_IMPORT_BYTES } from '../studies/import-table.js';
import { PutImportMappingDto } from './dto/import-mapping.dto.js';
import { InstrumentImportService } from './instrument-import.service.js';
import { RunsService } from './runs.service.js';

/** What routine runs need to know about a method version. */
@ApiTags('runs')
@ApiBearerAuth()
@Roles(Role.Analyst, Role.Reviewer, Role.QualityManager)
@Controller('method-versions/:id')
export class MethodVersionRunsController {
  constructor(
    private readonly runsService: RunsService,
    private readonly instrumentImport: InstrumentImportService,
  ) {}

  @Get('run-options')
  runOptions(@Param('id', ParseUUIDPipe) id: string): Promise<RunOptionsDto> {
    return this.runsService.runOptions(id);
  }

  @Get('control-chart')
  controlChart(@Param('id', ParseUUIDPipe) id: string): Promise<RunControlChartDto> {
    return this.runsService.controlChart(id);
  }

  @Get('import-mapping')
  importMapping(@Param('id', ParseUUIDPipe) id: string): Promise<ImportMappingDto> {
    return this.instrumentImport.get(id);
  }

  /** The column mapping of this version's instrument exports, saved for the next runs. */
  @Put('import-mapping')
  @Roles(Role.Analyst, Role.QualityManager)
  putImportMapping(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: PutImportMappingDto,
    @CurrentUser() actor: AuthUser,
  ): Promise<ImportMappingDto> {
    return this.instrumentImport.put(id, dto, actor);
  }

  /** Reads an instrument export (CSV or XLSX) through the saved mapping; nothing is stored. */
  @Post('instrument-import')
  @Roles(Role.Analyst)
  @HttpCode(200)
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: MAX_IMPORT_BYTES, files: 1 } }))
  readExport(
    @Param('id', ParseUUIDPipe) id: string,
    @UploadedFile() file: Express.Multer.File | undefined,
  ): Promise<InstrumentImportResult> {
    if (!file) throw new BadRequestException('Attach the instrument export as the form field "file".');
    return this.instrumentImport.read(id, file.buffer);
  }
}
