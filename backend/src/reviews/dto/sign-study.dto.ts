import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { MIN_JUSTIFICATION_LENGTH } from '@meritline/shared';
import { IsInt, IsNotEmpty, IsOptional, IsString, MaxLength, Min } from 'class-validator';

export class SignStudyDto {
  @ApiProperty({ description: 'The signer re-enters their password.' })
  @IsString()
  @IsNotEmpty({ message: 'Enter your password to sign.' })
  @MaxLength(200)
  password: string;

  @ApiPropertyOptional({ maxLength: 2000 })
  @IsOptional()
  @IsString()
  @MaxLength(2000)
  comment?: string;

  @ApiPropertyOptional({
    maxLength: 4000,
    description: `Required to approve a study that does not meet all its criteria: why it is fit for use all the same (at least ${MIN_JUSTIFICATION_LENGTH} characters).`,
  })
  @IsOptional()
  @IsString()
  @MaxLength(4000)
  justification?: string;

  @ApiPropertyOptional({ description: 'The lock version the signer saw; a newer one answers 409.' })
  @IsOptional()
  @IsInt()
  @Min(1)
  lockVersion?: number;
}
