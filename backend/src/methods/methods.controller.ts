import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { ApiChange, ApiConflict, ApiInvalid, ApiPasswordRefused, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { CreateMethodVersionDto } from './dto/create-method-version.dto.js';
import { CreateMethodDto } from './dto/create-method.dto.js';
import { CriteriaTemplateDto, MethodDto, MethodVersionDetailDto } from './dto/method.dto.js';
import { UpdateMethodVersionDto } from './dto/update-method-version.dto.js';
import { MethodsService } from './methods.service.js';

const EDITORS = [Role.QualityManager, Role.Admin, Role.Analyst];

@ApiTags('methods')
@ApiSignedIn()
@Controller()
export class MethodsController {
  constructor(private readonly methodsService: MethodsService) {}

  @Get('criteria-templates')
  @ApiOkResponse({ type: [CriteriaTemplateDto] })
  templates(): CriteriaTemplateDto[] {
    return [...this.methodsService.templates()] as CriteriaTemplateDto[];
  }

  @Get('methods')
  @ApiOkResponse({ type: [MethodDto] })
  findAll(): Promise<MethodDto[]> {
    return this.methodsService.findAll();
  }

  @Get('methods/:id')
  @ApiOkResponse({ type: MethodDto })
  @ApiRecord('method')
  findOne(@Param('id', ParseUUIDPipe) id: string): Promise<MethodDto> {
    return this.methodsService.findOne(id);
  }

  @Post('methods')
  @Roles(...EDITORS)
  @ApiCreatedResponse({ type: MethodDto, description: 'The method with version 1 in draft. Analysts propose; quality managers activate.' })
  @ApiInvalid()
  @ApiConflict('A method with this name already exists.')
  create(@Body() dto: CreateMethodDto, @CurrentUser() actor: AuthUser): Promise<MethodDto> {
    return this.methodsService.create(dto, actor);
  }

  @Post('methods/:id/versions')
  @Roles(...EDITORS)
  @ApiCreatedResponse({
    type: MethodVersionDetailDto,
    description: 'A new draft version; criteria and settings copied from the latest version unless given.',
  })
  @ApiRecord('method')
  @ApiInvalid()
  createVersion(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: CreateMethodVersionDto,
    @CurrentUser() actor: AuthUser,
  ): Promise<MethodVersionDetailDto> {
    return this.methodsService.createVersion(id, dto, actor);
  }

  @Get('method-versions/:id')
  @ApiOkResponse({ type: MethodVersionDetailDto })
  @ApiRecord('method version')
  findVersion(@Param('id', ParseUUIDPipe) id: string): Promise<MethodVersionDetailDto> {
    return this.methodsService.findVersion(id);
  }

  @Patch('method-versions/:id')
  @Roles(...EDITORS)
  @ApiOkResponse({ type: MethodVersionDetailDto })
  @ApiChange(
    'method version',
    'Someone changed the version since it was loaded (stale lock version), or its status does not allow the change.',
  )
  @ApiPasswordRefused()
  updateVersion(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdateMethodVersionDto,
    @CurrentUser() actor: AuthUser,
  ): Promise<MethodVersionDetailDto> {
    return this.methodsService.updateVersion(id, dto, actor);
  }
}
