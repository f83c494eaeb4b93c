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
}
