import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Role, type UserDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { ApiInvalid, ApiRecord, ApiSignedIn, ApiConflict } from '../common/openapi/api-responses.js';
import { UserResponseDto } from './dto/user.dto.js';
import { CreateInvitationDto } from './dto/create-invitation.dto.js';
import { UpdateUserDto } from './dto/update-user.dto.js';
import { toUserDto, UsersService } from './users.service.js';

@ApiTags('users')
@ApiSignedIn('Administrators only; nobody changes their own roles or deactivates themselves.')
@Roles(Role.Admin)
@Controller('users')
export class UsersController {
  constructor(private readonly usersService: UsersService) {}

  @Get()
  @ApiOkResponse({ type: [UserResponseDto] })
  async findAll(): Promise<UserDto[]> {
    return (await this.usersService.findAll()).map(toUserDto);
  }

  @Post('invitations')
  @ApiCreatedResponse({ type: UserResponseDto, description: 'The person, invited by e-mail.' })
  @ApiInvalid()
  @ApiConflict('A user with this e-mail already exists.')
  async invite(@Body() dto: CreateInvitationDto, @CurrentUser() actor: AuthUser): Promise<UserDto> {
    return toUserDto(await this.usersService.invite(dto, actor));
  }

  @Patch(':id')
  @ApiOkResponse({ type: UserResponseDto })
  @ApiRecord('user')
  @ApiInvalid()
  async update(@Param('id', ParseUUIDPipe) id: string, @Body() dto: UpdateUserDto, @CurrentUser() actor: AuthUser): Promise<UserDto> {
    return toUserDto(await this.usersService.update(id, dto, actor));
  }
}
