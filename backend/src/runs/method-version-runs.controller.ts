import { BadRequestException, Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Put, UploadedFile } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Role, type ImportMappingDto, type InstrumentImportResult, type RunControlChartDto, type RunOptionsDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { FileUpload } from '../common/files.js';
import { ApiChange, ApiRefusal, ApiInvalid, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import {
  ImportMappingResponseDto,
  InstrumentImportResponseDto,
  RunControlChartResponseDto,
  RunOptionsResponseDto,
} from './dto/run-response.dto.js';
import { MAX_IMPORT_BYTES } from '../studies/import-table.js';
import { PutImportMappingDto } from './dto/import-mapping.dto.js';
import { InstrumentImportService } from './instrument-import.service.js';
import { RunsService } from './runs.service.js';

/** What routine runs need to know about a method version. */
@ApiTags('runs')
@ApiSignedIn()
@Roles(Role.Analyst, Role.Reviewer, Role.QualityManager)
@Controller('method-versions/:id')
export class MethodVersionRunsController {
  constructor(
    private readonly runsService: RunsService,
    private readonly instrumentImport: InstrumentImportService,
  ) {}

  @Get('run-options')
  @ApiOkResponse({ type: RunOptionsResponseDto })
  @ApiRecord('method version')
  runOptions(@Param('id', ParseUUIDPipe) id: string): Promise<RunOptionsDto> {
    return this.runsService.runOptions(id);
  }

  @Get('control-chart')
  @ApiOkResponse({ type: RunControlChartResponseDto })
  @ApiRecord('method version')
  controlChart(@Param('id', ParseUUIDPipe) id: string): Promise<RunControlChartDto> {
    return this.runsService.controlChart(id);
  }

  @Get('import-mapping')
  @ApiOkResponse({ type: ImportMappingResponseDto })
  @ApiRecord('method version')
  importMapping(@Param('id', ParseUUIDPipe) id: string): Promise<ImportMappingDto> {
    return this.instrumentImport.get(id);
  }

  /** The column mapping of this version's instrument exports, saved for the next runs. */
  @Put('import-mapping')
  @Roles(Role.Analyst, Role.QualityManager)
  @ApiOkResponse({ type: ImportMappingResponseDto })
  @ApiChange('method version')
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
  @FileUpload(MAX_IMPORT_BYTES, 'The instrument export, CSV or XLSX, at most 5 MB.')
  @ApiOkResponse({ type: InstrumentImportResponseDto, description: 'Nothing is stored.' })
  @ApiRecord('method version')
  @ApiRefusal(400, 'No file attached as the form field "file".')
  @ApiInvalid('A file that cannot be read, or values that do not fit the run: the row and column are named.')
  readExport(
    @Param('id', ParseUUIDPipe) id: string,
    @UploadedFile() file: Express.Multer.File | undefined,
  ): Promise<InstrumentImportResult> {
    if (!file) throw new BadRequestException('Attach the instrument export as the form field "file".');
    return this.instrumentImport.read(id, file.buffer);
  }
}
