import { Body, Controller, Get, HttpCode, Inject, Ip, Post, Put, Req, Res } from '@nestjs/common';
import { ApiAcceptedResponse, ApiNoContentResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { Role, type LoginResponse, type SessionSettingsDto, type UserDto } from '@meritline/shared';
import type { Response } from 'express';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { ApiRefusal, ApiInvalid, ApiSignedIn, ApiThrottled } from '../common/openapi/api-responses.js';
import { UserResponseDto } from '../users/dto/user.dto.js';
import { toUserDto, UsersService } from '../users/users.service.js';
import { AuthService, PASSWORD_RESET_ANSWER } from './auth.service.js';
import { LoginResponseDto, PasswordResetAnswerDto, SessionSettingsResponseDto } from './dto/auth-response.dto.js';
import { AcceptInvitationDto } from './dto/accept-invitation.dto.js';
import { ChangePasswordDto } from './dto/change-password.dto.js';
import { LoginDto } from './dto/login.dto.js';
import { LinkTokenDto, PasswordResetConfirmDto, PasswordResetRequestDto } from './dto/password-reset.dto.js';
import { UpdateSessionSettingsDto } from './dto/session-settings.dto.js';
import { SESSION_COOKIE, sessionCookieOptions } from './session-cookie.js';
import { SessionSettingsService } from './session-settings.service.js';
import type { SessionUser } from './sessions.service.js';

@ApiTags('auth')
@ApiThrottled()
@Controller('auth')
export class AuthController {
  constructor(
    private readonly authService: AuthService,
    private readonly usersService: UsersService,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
  ) {}

  /** The web app's session lives in an HttpOnly cookie; the token in the body serves scripts and API clients. */
  private async startSession(response: Response, signingIn: Promise<LoginResponse>): Promise<LoginResponse> {
    const session = await signingIn;
    response.cookie(SESSION_COOKIE, session.accessToken, sessionCookieOptions(this.config.publicUrl));
    return session;
  }

  @Public()
  @Post('login')
  @HttpCode(200)
  @ApiOkResponse({ type: LoginResponseDto })
  @ApiRefusal(401, 'Unknown e-mail, wrong password, or a locked or deactivated account.')
  @ApiInvalid()
  login(@Body() dto: LoginDto, @Ip() address: string, @Res({ passthrough: true }) response: Response): Promise<LoginResponse> {
    return this.startSession(response, this.authService.login(dto, address));
  }

  @Public()
  @Post('accept-invitation')
  @HttpCode(200)
  @ApiOkResponse({ type: LoginResponseDto, description: 'The password is set and the person signed in.' })
  @ApiRefusal(400, 'The invitation link is not valid or has expired.')
  @ApiInvalid()
  acceptInvitation(@Body() dto: AcceptInvitationDto, @Res({ passthrough: true }) response: Response): Promise<LoginResponse> {
    return this.startSession(response, this.authService.acceptInvitation(dto));
  }

  @Public()
  @Post('password-reset')
  @HttpCode(202)
  @ApiAcceptedResponse({ type: PasswordResetAnswerDto })
  @ApiInvalid()
  requestPasswordReset(@Body() dto: PasswordResetRequestDto): Promise<typeof PASSWORD_RESET_ANSWER> {
    return this.authService.requestPasswordReset(dto.email);
  }

  @Public()
  @Post('password-reset/confirm')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'The new password is set.' })
  @ApiInvalid('A password the policy refuses, or a link that is unknown, used or expired.')
  confirmPasswordReset(@Body() dto: PasswordResetConfirmDto): Promise<void> {
    return this.authService.confirmPasswordReset(dto);
  }

  @Public()
  @Post('unlock/confirm')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'The account is unlocked.' })
  @ApiInvalid('A link that is unknown, used or expired.')
  confirmUnlock(@Body() dto: LinkTokenDto): Promise<void> {
    return this.authService.confirmUnlock(dto.token);
  }

  @ApiSignedIn()
  @Get('me')
  @ApiOkResponse({ type: UserResponseDto })
  async me(@CurrentUser() user: AuthUser): Promise<UserDto> {
    return toUserDto(await this.usersService.findById(user.id));
  }

  @ApiSignedIn()
  @Post('logout')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'The session is ended.' })
  async logout(@Req() request: { user: SessionUser }, @Res({ passthrough: true }) response: Response): Promise<void> {
    await this.authService.logout(request.user, request.user.sessionId);
    response.clearCookie(SESSION_COOKIE, sessionCookieOptions(this.config.publicUrl));
  }

  @ApiSignedIn()
  @Post('change-password')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'The new password is set.' })
  @ApiInvalid('The current password is not correct, or the policy refuses the new one.')
  changePassword(@CurrentUser() user: AuthUser, @Body() dto: ChangePasswordDto): Promise<void> {
    return this.authService.changePassword(user, dto);
  }
}

@ApiTags('settings')
@ApiSignedIn('Administrators only.')
@Controller('settings/session')
export class SessionSettingsController {
  constructor(private readonly settings: SessionSettingsService) {}

  /** Every signed-in user reads it: the browser warns before the server's idle limit. */
  @Get()
  @ApiOkResponse({ type: SessionSettingsResponseDto })
  get(): Promise<SessionSettingsDto> {
    return this.settings.get();
  }

  @Roles(Role.Admin)
  @Put()
  @ApiOkResponse({ type: SessionSettingsResponseDto })
  @ApiInvalid()
  update(@Body() dto: UpdateSessionSettingsDto, @CurrentUser() actor: AuthUser): Promise<SessionSettingsDto> {
    return this.settings.update({ idleMinutes: dto.idleMinutes }, actor);
  }
}
