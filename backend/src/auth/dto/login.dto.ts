import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength, MinLength } from 'class-validator';

export class LoginDto {
  @ApiProperty({ example: 'analyst@meritline.test' })
  @IsString()
  @MinLength(1, { message: 'Enter your e-mail address.' })
  @MaxLength(254)
  email: string;

  @ApiProperty({ example: 'meritline-demo' })
  @IsString()
  @MinLength(1, { message: 'Enter your password.' })
  @MaxLength(200)
  password: string;
}
