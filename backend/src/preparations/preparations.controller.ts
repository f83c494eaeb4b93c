import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Role } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { ApiInvalid, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { CreatePreparationDto, PreparationPreviewRequestDto } from './dto/preparation-request.dto.js';
import { PreparationPreviewResponseDto, PreparationResponseDto } from './dto/preparation-response.dto.js';
import { PreparationsService } from './preparations.service.js';

const REFUSED =
  'Purity outside (0, 1], a mass or volume not above zero, a negative tolerance or uncertainty, or an unknown, expired or withdrawn material: { statusCode, message, errors: [{ field, code, message }] }. Nothing is saved.';

@ApiTags('preparations')
@ApiSignedIn('Analysts prepare standards.')
@Controller('preparations')
export class PreparationsController {
  constructor(private readonly preparations: PreparationsService) {}

  @Post('preview')
  @HttpCode(200)
  @ApiOkResponse({
    type: PreparationPreviewResponseDto,
    description: 'Stock and working standards with u and the budget; nothing is saved.',
  })
  @ApiInvalid(REFUSED)
  preview(@Body() dto: PreparationPreviewRequestDto) {
    return this.preparations.preview(dto);
  }

  @Post()
  @Roles(Role.Analyst)
  @ApiCreatedResponse({ type: PreparationResponseDto, description: 'Saved for good; a preparation is never changed.' })
  @ApiInvalid(REFUSED)
  create(@Body() dto: CreatePreparationDto, @CurrentUser() actor: AuthUser) {
    return this.preparations.create(dto, actor);
  }

  @Get()
  @ApiOkResponse({ type: [PreparationResponseDto], description: 'Newest first.' })
  findAll() {
    return this.preparations.findAll();
  }

  @Get(':id')
  @ApiOkResponse({ type: PreparationResponseDto })
  @ApiRecord('preparation')
  findOne(@Param('id', ParseUUIDPipe) id: string) {
    return this.preparations.findOne(id);
  }
}
