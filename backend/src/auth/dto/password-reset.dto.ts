import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';
import { PASSWORD_MAX_LENGTH } from '@meritline/shared';

export class PasswordResetRequestDto {
  @ApiProperty({ example: 'analyst@meritline.test' })
  @IsString()
  @MinLength(1, { message: 'Enter your e-mail address.' })
  @MaxLength(254)
  email: string;
}

export class LinkTokenDto {
  @ApiProperty()
  @IsString()
  @MinLength(20, { message: 'The link is incomplete.' })
  @MaxLength(100)
  token: string;
}

export class PasswordResetConfirmDto extends LinkTokenDto {
  @ApiProperty()
  @IsString()
  @MaxLength(PASSWORD_MAX_LENGTH)
  password: string;
}
