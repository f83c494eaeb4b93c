import { ApiProperty, PickType } from '@nestjs/swagger';
import type { LoginResponse, SessionSettingsDto } from '@meritline/shared';
import { UserResponseDto } from '../../users/dto/user.dto.js';

export class SignedInUserDto extends PickType(UserResponseDto, ['id', 'email', 'name', 'roles'] as const) {}

export class LoginResponseDto implements LoginResponse {
  @ApiProperty({ description: 'The bearer token of the new session.' }) accessToken: string;
  @ApiProperty({ type: SignedInUserDto }) user: SignedInUserDto;
}

export class PasswordResetAnswerDto {
  @ApiProperty({ description: 'The same words whether or not an account exists for the address.' }) message: string;
}

export class SessionSettingsResponseDto implements SessionSettingsDto {
  @ApiProperty({ description: 'Minutes without activity after which the server ends a session.' }) idleMinutes: number;
}
