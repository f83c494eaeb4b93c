import { ApiPropertyOptional } from '@nestjs/swagger';
import { ArrayMinSize, ArrayUnique, IsArray, IsBoolean, IsEnum, IsString, MaxLength, MinLength, ValidateIf } from 'class-validator';
import { Role } from '@meritline/shared';

// Leaving a field out keeps it; null is not "keep" but an invalid value (IsOptional would let it through to the database).
const present = ValidateIf((_, value: unknown) => value !== undefined);

export class UpdateUserDto {
  @ApiPropertyOptional({ example: 'Dana Fischer' })
  @present
  @IsString({ message: 'Enter the person’s name.' })
  @MinLength(1, { message: 'Enter the person’s name.' })
  @MaxLength(120)
  name?: string;

  @ApiPropertyOptional({ enum: Role, isArray: true })
  @present
  @IsArray({ message: 'Choose at least one role.' })
  @ArrayMinSize(1, { message: 'Choose at least one role.' })
  @ArrayUnique()
  @IsEnum(Role, { each: true, message: 'Unknown role.' })
  roles?: Role[];

  @ApiPropertyOptional()
  @present
  @IsBoolean({ message: 'active must be true or false.' })
  active?: boolean;
}
