import { ApiProperty } from '@nestjs/swagger';
import { ArrayMinSize, ArrayUnique, IsArray, IsEmail, IsEnum, IsString, MaxLength, MinLength } from 'class-validator';
import { Transform } from 'class-transformer';
import { Role } from '@meritline/shared';

export class CreateInvitationDto {
  @ApiProperty({ example: 'new.analyst@meritline.test' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toLowerCase() : value))
  @IsEmail({}, { message: 'Enter a valid e-mail address.' })
  @MaxLength(254)
  email: string;

  @ApiProperty({ example: 'Dana Fischer' })
  @IsString()
  @MinLength(1, { message: 'Enter the person’s name.' })
  @MaxLength(120)
  name: string;

  @ApiProperty({ enum: Role, isArray: true })
  @IsArray()
  @ArrayMinSize(1, { message: 'Choose at least one role.' })
  @ArrayUnique()
  @IsEnum(Role, { each: true, message: 'Unknown role.' })
  roles: Role[];
}
