import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsBoolean, IsNumber, IsOptional, IsPositive, Max, Min } from 'class-validator';

/** Settings of a method version; fields left out keep their current (or the template's) value. */
export class MethodVersionSettingsDto {
  @ApiPropertyOptional({ description: 'A quality manager must release a study after the reviewer’s approval.' })
  @IsOptional()
  @IsBoolean()
  requiresQualityRelease?: boolean;

  @ApiPropertyOptional({ description: 'Check standards in a routine run must recover within 100 ± this %.', example: 10 })
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0.1)
  @Max(50)
  checkTolerancePct?: number;

  @ApiPropertyOptional({ description: 'One-point calibration only when |intercept| is at most this % of the top response.', example: 5 })
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false })
  @Min(0)
  @Max(100)
  onePointMaxInterceptPct?: number;

  @ApiPropertyOptional({
    description: 'Mean recoveries of two versions within this many percentage points count as equivalent (default 5).',
    example: 5,
  })
  @IsOptional()
  @IsNumber(
    { allowNaN: false, allowInfinity: false },
    { message: 'Give the recovery equivalence margin as a number of percentage points.' },
  )
  @IsPositive({ message: 'The recovery equivalence margin must be more than 0 percentage points.' })
  @Max(50)
  recoveryEquivalenceMarginPct?: number;

  @ApiPropertyOptional({
    description: 'β of the accuracy profile: the expected proportion of future results inside the tolerance limits (0.80 unless set).',
    example: 0.8,
  })
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give β as a number such as 0.80 or 0.95.' })
  @Min(0.5, { message: 'β must be at least 0.50.' })
  @Max(0.99, { message: 'β must be at most 0.99.' })
  accuracyBeta?: number;

  @ApiPropertyOptional({ description: 'Acceptance limits of the accuracy profile, ±λ % (10 unless set).', example: 10 })
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give λ as a number of percent.' })
  @IsPositive({ message: 'λ must be more than 0 %.' })
  @Max(100, { message: 'λ must be at most 100 %.' })
  accuracyLambdaPct?: number;

  @ApiPropertyOptional({ description: 'Coverage factor k of the expanded uncertainty (2 unless set).', example: 2 })
  @IsOptional()
  @IsNumber({ allowNaN: false, allowInfinity: false }, { message: 'Give the coverage factor k as a number.' })
  @Min(1, { message: 'The coverage factor k must be at least 1.' })
  @Max(5, { message: 'The coverage factor k must be at most 5.' })
  coverageFactor?: number;
}
