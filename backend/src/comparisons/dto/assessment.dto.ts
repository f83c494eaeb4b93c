import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { MIN_JUSTIFICATION_LENGTH } from '@meritline/shared';
import { IsInt, IsNumber, IsOptional, IsPositive, IsString, IsUUID, Max, MaxLength, Min, MinLength } from 'class-validator';

export class CreateAssessmentDto {
  @ApiPropertyOptional({ format: 'uuid', description: 'The earlier version to compare with; default the version numbered just before.' })
  @IsOptional()
  @IsUUID('all', { message: 'compareWith must name a method version' })
  compareWith?: string;

  @ApiProperty({ description: 'The assessment in the quality manager’s words.', minLength: MIN_JUSTIFICATION_LENGTH, maxLength: 4000 })
  @IsString({ message: 'Write the assessment.' })
  @MinLength(MIN_JUSTIFICATION_LENGTH, { message: `Write the assessment in at least ${MIN_JUSTIFICATION_LENGTH} characters.` })
  @MaxLength(4000, { message: 'Keep the assessment under 4000 characters.' })
  statement: string;

  @ApiProperty({ description: 'The signer’s password, re-entered for the e-signature.', maxLength: 200 })
  @IsString({ message: 'Enter your password to sign the assessment.' })
  @MinLength(1, { message: 'Enter your password to sign the assessment.' })
  @MaxLength(200)
  password: string;

  @ApiProperty({ description: 'Lock version of the assessed version as the signer saw it; a stale one answers 409.' })
  @IsInt({ message: 'lockVersion must be a whole number' })
  @Min(1)
  lockVersion: number;

  @ApiPropertyOptional({ description: 'Equivalence margin of the mean recoveries in percentage points.', maximum: 50 })
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'margin must be a number of percentage points' })
  @IsPositive({ message: 'margin must be greater than 0 percentage points' })
  @Max(50, { message: 'margin must be at most 50 percentage points' })
  margin?: number;
}
