import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { Role, type UserDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CreateInvitationDto } from './dto/create-invitation.dto.js';
import { UpdateUserDto } from './dto/update-user.dto.js';
import { toUserDto, UsersService } from './users.service.js';

@ApiTags('users')
@ApiBearerAuth()
@Roles(Role.Admin)
@Controller('users')
export class UsersController {
  constructor(private readonly usersService: UsersService) {}

  @Get()
  async findAll(): Promise<UserDto[]> {
    return (await this.usersService.findAll()).map(toUserDto);
  }

  @Post('invitations')
  async invite(@Body() dto: CreateInvitationDto, @CurrentUser() actor: AuthUser): Promise<UserDto> {
    return toUserDto(await this.usersService.invite(dto, actor));
  }

  @Patch(':id')
  async update(@Param('id', ParseUUIDPipe) id: string, @Body() dto: UpdateUserDto, @CurrentUser() actor: AuthUser): Promise<UserDto> {
    return toUserDto(await this.usersService.update(id, dto, actor));
  }
}
