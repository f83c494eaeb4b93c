import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { PASSWORD_MAX_LENGTH, PASSWORD_MESSAGES, PASSWORD_MIN_LENGTH } from '@meritline/shared';

export class AcceptInvitationDto {
  @ApiProperty()
  @IsString()
  @MinLength(20, { message: 'The invitation link is incomplete.' })
  @MaxLength(100)
  token: string;

  @ApiProperty({ example: 'Dana Fischer' })
  @IsString()
  @MinLength(1, { message: 'Enter your name.' })
  @MaxLength(120)
  name: string;

  @ApiProperty({ minLength: PASSWORD_MIN_LENGTH })
  @IsString()
  @MinLength(PASSWORD_MIN_LENGTH, { message: PASSWORD_MESSAGES['too-short'] })
  @MaxLength(PASSWORD_MAX_LENGTH)
  password: string;
}
