import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  NotFoundException,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Query,
  StreamableFile,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import {
  ApiBody,
  ApiConsumes,
  ApiCreatedResponse,
  ApiExtraModels,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
  getSchemaPath,
} from '@nestjs/swagger';
import { IMPORT_SECTIONS, type ImportSection, Role } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { ApiChange, ApiConflict, ApiRefusal, ApiFile, ApiInvalid, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { CreateStudyDto } from './dto/create-study.dto.js';
import { ImportStudyDto } from './dto/import-study.dto.js';
import { ListStudiesQueryDto } from './dto/list-studies.query.dto.js';
import { ImportPreviewDto, StudyDto, StudyPageDto } from './dto/study.dto.js';
import { ReassignStudyDto } from './dto/reassign-study.dto.js';
import { UpdateStudyDto } from './dto/update-study.dto.js';
import { MAX_IMPORT_BYTES } from './import-table.js';
import { importTemplate } from './study-import.js';
import { StudiesService } from './studies.service.js';

@ApiTags('studies')
@ApiSignedIn()
@Controller()
export class StudiesController {
  constructor(private readonly studiesService: StudiesService) {}

  @Get('studies')
  @ApiOkResponse({ type: StudyPageDto })
  @ApiInvalid()
  findPage(@Query() query: ListStudiesQueryDto, @CurrentUser() user: AuthUser): Promise<StudyPageDto> {
    return this.studiesService.findPage(query, user);
  }

  @Get('studies/:id')
  @ApiOkResponse({ type: StudyDto })
  @ApiRecord('study')
  findOne(@Param('id', ParseUUIDPipe) id: string): Promise<StudyDto> {
    return this.studiesService.findOne(id);
  }

  @Post('studies')
  @Roles(Role.Analyst)
  @ApiCreatedResponse({
    type: StudyDto,
    description: 'A draft, with the server’s result (or the reasons the data cannot be evaluated yet).',
  })
  @ApiInvalid()
  @ApiRefusal(404, 'No such method version.')
  create(@Body() dto: CreateStudyDto, @CurrentUser() actor: AuthUser): Promise<StudyDto> {
    return this.studiesService.create(dto, actor);
  }

  @Patch('studies/:id')
  @Roles(Role.Analyst)
  @ApiOkResponse({ type: StudyDto })
  @ApiChange('study', 'Someone changed the study since it was loaded (stale lock version), or it is locked while under review.')
  update(@Param('id', ParseUUIDPipe) id: string, @Body() dto: UpdateStudyDto, @CurrentUser() actor: AuthUser): Promise<StudyDto> {
    return this.studiesService.update(id, dto, actor);
  }

  @Post('studies/:id/reassign')
  @Roles(Role.Admin)
  @HttpCode(200)
  @ApiOkResponse({ type: StudyDto, description: 'The draft, now written by the analyst named; audited with the reason.' })
  @ApiChange('study', 'Stale lock version, or the study is no longer a draft.')
  reassign(@Param('id', ParseUUIDPipe) id: string, @Body() dto: ReassignStudyDto, @CurrentUser() actor: AuthUser): Promise<StudyDto> {
    return this.studiesService.reassign(id, dto, actor);
  }

  @Delete('studies/:id')
  @Roles(Role.Analyst)
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'The author’s own draft is deleted.' })
  @ApiRecord('study')
  @ApiConflict('Only a draft can be deleted.')
  remove(@Param('id', ParseUUIDPipe) id: string, @CurrentUser() actor: AuthUser): Promise<void> {
    return this.studiesService.remove(id, actor);
  }

  @Post('studies/:id/imports')
  @Roles(Role.Analyst)
  @HttpCode(200)
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: MAX_IMPORT_BYTES, files: 1 } }))
  @ApiConsumes('multipart/form-data')
  @ApiBody({ type: ImportStudyDto })
  @ApiExtraModels(ImportPreviewDto, StudyDto)
  @ApiOkResponse({
    description:
      'dryRun: the preview (errors listed); otherwise the study with the section replaced. A real import with any error answers 422 and saves nothing.',
    schema: { oneOf: [{ $ref: getSchemaPath(ImportPreviewDto) }, { $ref: getSchemaPath(StudyDto) }] },
  })
  @ApiChange('study')
  @ApiRefusal(413, 'The file is larger than the import limit.')
  importFile(
    @Param('id', ParseUUIDPipe) id: string,
    @UploadedFile() file: Express.Multer.File | undefined,
    @Body() dto: ImportStudyDto,
    @CurrentUser() actor: AuthUser,
  ): Promise<ImportPreviewDto | StudyDto> {
    return this.studiesService.importFile(id, file, dto, actor);
  }

  @Get('import-templates/:section')
  @ApiFile('A CSV template for the section: the header and two rows of invented numbers.', 'text/csv')
  @ApiRefusal(404, 'No import template for this section.')
  template(@Param('section') section: string): StreamableFile {
    if (!IMPORT_SECTIONS.includes(section as ImportSection)) {
      throw new NotFoundException(`There is no import template for “${section}”; the sections are ${IMPORT_SECTIONS.join(', ')}.`);
    }
    return new StreamableFile(Buffer.from(importTemplate(section as ImportSection)), {
      type: 'text/csv; charset=utf-8',
      disposition: `attachment; filename="${section}-template.csv"`,
    });
  }
}
