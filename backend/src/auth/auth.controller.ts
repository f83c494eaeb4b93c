import { Body, Controller, Get, HttpCode, Ip, Post, Put, Req } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { Role, type LoginResponse, type SessionSettingsDto, type UserDto } from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { toUserDto, UsersService } from '../users/users.service.js';
import { AuthService, PASSWORD_RESET_ANSWER } from './auth.service.js';
import { AcceptInvitationDto } from './dto/accept-invitation.dto.js';
import { ChangePasswordDto } from './dto/change-password.dto.js';
import { LoginDto } from './dto/login.dto.js';
import { LinkTokenDto, PasswordResetConfirmDto, PasswordResetRequestDto } from './dto/password-reset.dto.js';
import { UpdateSessionSettingsDto } from './dto/session-settings.dto.js';
import type { SessionUser } from './jwt.strategy.js';
import { SessionSettingsService } from './session-settings.service.js';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly authService: AuthService,
    private readonly usersService: UsersService,
  ) {}

  @Public()
  @Post('login')
  @HttpCode(200)
  login(@Body() dto: LoginDto, @Ip() address: string): Promise<LoginResponse> {
    return this.authService.login(dto, address);
  }

  @Public()
  @Post('accept-invitation')
  @HttpCode(200)
  acceptInvitation(@Body() dto: AcceptInvitationDto): Promise<LoginResponse> {
    return this.authService.acceptInvitation(dto);
  }

  @Public()
  @Post('password-reset')
  @HttpCode(202)
  requestPasswordReset(@Body() dto: PasswordResetRequestDto): Promise<typeof PASSWORD_RESET_ANSWER> {
    return this.authService.requestPasswordReset(dto.email);
  }

  @Public()
  @Post('password-reset/confirm')
  @HttpCode(204)
  confirmPasswordReset(@Body() dto: PasswordResetConfirmDto): Promise<void> {
    return this.authService.confirmPasswordReset(dto);
  }

  @Public()
  @Post('unlock/confirm')
  @HttpCode(204)
  confirmUnlock(@Body() dto: LinkTokenDto): Promise<void> {
    return this.authService.confirmUnlock(dto.token);
  }

  @ApiBearerAuth()
  @Get('me')
  async me(@CurrentUser() user: AuthUser): Promise<UserDto> {
    return toUserDto(await this.usersService.findById(user.id));
  }

  @ApiBearerAuth()
  @Post('logout')
  @HttpCode(204)
  logout(@Req() request: { user: SessionUser }): Promise<void> {
    return this.authService.logout(request.user, request.user.sessionId);
  }

  @ApiBearerAuth()
  @Post('change-password')
  @HttpCode(204)
  changePassword(@CurrentUser() user: AuthUser, @Body() dto: ChangePasswordDto): Promise<void> {
    return this.authService.changePassword(user, dto);
  }
}

@ApiTags('settings')
@ApiBearerAuth()
@Controller('settings/session')
export class SessionSettingsController {
  constructor(private readonly settings: SessionSettingsService) {}

  /** Every signed-in user reads it: the browser warns before the server's idle limit. */
  @Get()
  get(): Promise<SessionSettingsDto> {
    return this.settings.get();
  }

  @Roles(Role.Admin)
  @Put()
  update(@Body() dto: UpdateSessionSettingsDto, @CurrentUser() actor: AuthUser): Promise<SessionSettingsDto> {
    return this.settings.update({ idleMinutes: dto.idleMinutes }, actor);
  }
}
