import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post, Put, Res, StreamableFile, UploadedFile } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { MAX_CERTIFICATE_BYTES, Role } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { download, FileUpload } from '../common/files.js';
import { ApiChange, ApiConflict, ApiFile, ApiInvalid, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { CreateReferenceMaterialDto } from './dto/create-reference-material.dto.js';
import { LockVersionDto } from './dto/reference-material-fields.dto.js';
import { ReferenceMaterialResponseDto } from './dto/reference-material.dto.js';
import { UpdateReferenceMaterialDto } from './dto/update-reference-material.dto.js';
import { WithdrawReferenceMaterialDto } from './dto/withdraw-reference-material.dto.js';
import { ReferenceMaterialsService } from './reference-materials.service.js';

const KEEPERS = [Role.QualityManager, Role.Admin];
const STALE = 'Stale lock version, a withdrawn material, or a duplicate supplier, certificate and lot.';

@ApiTags('reference-materials')
@ApiSignedIn('Only quality managers and administrators keep the register.')
@Controller('reference-materials')
export class ReferenceMaterialsController {
  constructor(private readonly materials: ReferenceMaterialsService) {}

  @Get()
  @ApiOkResponse({ type: [ReferenceMaterialResponseDto], description: 'The register, with status and days to expiry.' })
  findAll() {
    return this.materials.findAll();
  }

  @Get('expiring')
  @ApiOkResponse({ type: [ReferenceMaterialResponseDto], description: 'Materials in use that expire within 30 days, soonest first.' })
  findExpiring() {
    return this.materials.findExpiring();
  }

  @Get(':id')
  @ApiOkResponse({ type: ReferenceMaterialResponseDto })
  @ApiRecord('reference material')
  findOne(@Param('id', ParseUUIDPipe) id: string) {
    return this.materials.findOne(id);
  }

  @Post()
  @Roles(...KEEPERS)
  @ApiCreatedResponse({ type: ReferenceMaterialResponseDto })
  @ApiInvalid()
  @ApiConflict(STALE)
  create(@Body() dto: CreateReferenceMaterialDto, @CurrentUser() actor: AuthUser) {
    return this.materials.create(dto, actor);
  }

  @Patch(':id')
  @Roles(...KEEPERS)
  @ApiOkResponse({ type: ReferenceMaterialResponseDto })
  @ApiChange('reference material', STALE)
  update(@Param('id', ParseUUIDPipe) id: string, @Body() dto: UpdateReferenceMaterialDto, @CurrentUser() actor: AuthUser) {
    return this.materials.update(id, dto, actor);
  }

  @Post(':id/withdraw')
  @HttpCode(200)
  @Roles(...KEEPERS)
  @ApiOkResponse({ type: ReferenceMaterialResponseDto, description: 'Withdrawn for good; preparations from it are refused.' })
  @ApiChange('reference material', STALE)
  withdraw(@Param('id', ParseUUIDPipe) id: string, @Body() dto: WithdrawReferenceMaterialDto, @CurrentUser() actor: AuthUser) {
    return this.materials.withdraw(id, dto, actor);
  }

  @Put(':id/certificate')
  @Roles(...KEEPERS)
  @FileUpload(MAX_CERTIFICATE_BYTES, 'The certificate as a PDF, at most 10 MB.', { lockVersion: { type: 'integer' } })
  @ApiOkResponse({ type: ReferenceMaterialResponseDto })
  @ApiRecord('reference material')
  @ApiInvalid('No file, or not a PDF.')
  @ApiConflict(STALE)
  uploadCertificate(
    @Param('id', ParseUUIDPipe) id: string,
    @UploadedFile() file: Express.Multer.File | undefined,
    @Body() dto: LockVersionDto,
    @CurrentUser() actor: AuthUser,
  ) {
    return this.materials.uploadCertificate(id, file, dto.lockVersion, actor);
  }

  @Get(':id/certificate')
  @ApiFile('The certificate as uploaded.', 'application/pdf')
  @ApiRecord('reference material, or no certificate uploaded')
  async certificate(@Param('id', ParseUUIDPipe) id: string, @Res({ passthrough: true }) res: Response): Promise<StreamableFile> {
    const file = await this.materials.certificate(id);
    return download(res, file.pdf, 'application/pdf', file.fileName);
  }
}
