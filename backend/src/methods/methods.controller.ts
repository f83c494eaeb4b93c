import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CreateMethodVersionDto } from './dto/create-method-version.dto.js';
import { CreateMethodDto } from './dto/create-method.dto.js';
import { CriteriaTemplateDto, MethodDto, MethodVersionDetailDto } from './dto/method.dto.js';
import { UpdateMethodVersionDto } from './dto/update-method-version.dto.js';
import { MethodsService } from './methods.service.js';

const EDITORS = [Role.QualityManager, Role.Admin, Role.Analyst];

@ApiTags('methods')
@ApiBearerAuth()
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
  findOne(@Param('id', ParseUUIDPipe) id: string): Promise<MethodDto> {
    return this.methodsService.findOne(id);
  }

  @Post('methods')
  @Roles(...EDITORS)
  @ApiCreatedResponse({ type: MethodDto, description: 'The method with version 1 in draft. Analysts propose; quality managers activate.' })
  create(@Body() dto: CreateMethodDto, @CurrentUser() actor: AuthUser): Promise<MethodDto> {
    return this.methodsService.create(dto, actor);
  }

  @Post('methods/:id/versions')
  @Roles(...EDITORS)
  @ApiCreatedResponse({
    type: MethodVersionDetailDto,
    description: 'A new draft version; criteria and settings copied from the latest version unless given.',
  })
  createVersion(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: CreateMethodVersionDto,
    @CurrentUser() actor: AuthUser,
  ): Promise<MethodVersionDetailDto> {
    return this.methodsService.createVersion(id, dto, actor);
  }

  @Get('method-versions/:id')
  @ApiOkResponse({ type: MethodVersionDetailDto })
  findVersion(@Param('id', ParseUUIDPipe) id: string): Promise<MethodVersionDetailDto> {
    return this.methodsService.findVersion(id);
  }

  @Patch('method-versions/:id')
  @Roles(...EDITORS)
  @ApiOkResponse({ type: MethodVersionDetailDto })
  updateVersion(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: UpdateMethodVersionDto,
    @CurrentUser() actor: AuthUser,
  ): Promise<MethodVersionDetailDto> {
    return this.methodsService.updateVersion(id, dto, actor);
  }
}
