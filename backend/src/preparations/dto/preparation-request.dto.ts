import { applyDecorators } from '@nestjs/common';
import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsIn, IsNumber, IsObject, IsUUID, Max, Min, ValidateNested } from 'class-validator';
import {
  MASS_UNITS,
  MAX_DILUTION_STEPS,
  TOLERANCE_DISTRIBUTIONS,
  type MassUnit,
  type PreparationStep,
  type PreparationStock,
  type ToleranceDistribution,
} from '@meritline/shared';
import { IfPresent } from '../../common/validation.js';
import { RequiredText } from '../../methods/dto/text.decorators.js';

const FINITE = { allowNaN: false, allowInfinity: false };
// Signs and zero are the engine's to judge (it names the field and the reason); these bound the magnitude only.
const Quantity = (max = 1e9) =>
  applyDecorators(
    IsNumber(FINITE, { message: 'Enter a number.' }),
    Min(-max, { message: `Enter a number between ${-max} and ${max}.` }),
    Max(max, { message: `Enter a number between ${-max} and ${max}.` }),
  );
const OptionalQuantity = (max = 1e9) => applyDecorators(IfPresent(), Quantity(max));
const Distribution = () => IsIn(TOLERANCE_DISTRIBUTIONS, { message: 'Choose rectangular or triangular.' });

export class PreparationSourceDto {
  @ApiPropertyOptional({ description: 'A registered reference material certified for purity; or give purity and uPurity.' })
  @IfPresent()
  @IsUUID('all', { message: 'Choose a registered reference material.' })
  materialId?: string;

  @ApiPropertyOptional({ example: 0.9999, description: 'Mass fraction, above 0 and at most 1.' })
  @OptionalQuantity(10)
  purity?: number;

  @ApiPropertyOptional({ example: 0.0000577, description: 'Standard uncertainty of the purity (mass fraction).' })
  @OptionalQuantity(10)
  uPurity?: number;
}

export class PreparationStockDto implements PreparationStock {
  @ApiProperty({ example: 100.28 }) @Quantity() mass: number;
  @ApiProperty({ example: 0.05, description: 'Standard uncertainty of the weighing, in the mass unit.' }) @Quantity() uMass: number;
  @ApiProperty({ enum: MASS_UNITS }) @IsIn(MASS_UNITS, { message: 'Choose µg, mg or g.' }) massUnit: MassUnit;
  @ApiProperty({ example: 100, description: 'mL' }) @Quantity(1e6) volume: number;
  @ApiProperty({ example: 0.1, description: 'Half-width of the flask tolerance, mL.' }) @Quantity(1e6) volumeTolerance: number;
  @ApiProperty({ enum: TOLERANCE_DISTRIBUTIONS }) @Distribution() volumeDistribution: ToleranceDistribution;
  @ApiPropertyOptional({ example: 0.02, description: 'SD of filling, mL.' }) @OptionalQuantity(1e6) volumeRepeatability?: number;
  @ApiPropertyOptional({ example: 4, description: '± °C.' }) @OptionalQuantity(100) temperatureRange?: number;
  @ApiPropertyOptional({ example: 2.1e-4, description: 'Per °C; water when left out.' }) @OptionalQuantity(1) expansionCoefficient?: number;
}

export class PreparationStepDto implements PreparationStep {
  @ApiProperty({ example: 1, description: 'mL taken from the previous solution.' }) @Quantity(1e6) aliquot: number;
  @ApiProperty({ example: 0.006, description: 'Half-width, mL.' }) @Quantity(1e6) aliquotTolerance: number;
  @ApiProperty({ enum: TOLERANCE_DISTRIBUTIONS }) @Distribution() aliquotDistribution: ToleranceDistribution;
  @ApiProperty({ example: 100, description: 'Final volume, mL.' }) @Quantity(1e6) volume: number;
  @ApiProperty({ example: 0.1, description: 'Half-width, mL.' }) @Quantity(1e6) volumeTolerance: number;
  @ApiProperty({ enum: TOLERANCE_DISTRIBUTIONS }) @Distribution() volumeDistribution: ToleranceDistribution;
}

export class PreparationPreviewRequestDto {
  @ApiProperty({ type: PreparationSourceDto })
  @IsObject({ message: 'Give the source: a reference material, or a purity with its uncertainty.' })
  @ValidateNested()
  @Type(() => PreparationSourceDto)
  source: PreparationSourceDto;

  @ApiProperty({ type: PreparationStockDto })
  @IsObject({ message: 'Describe the stock solution.' })
  @ValidateNested()
  @Type(() => PreparationStockDto)
  stock: PreparationStockDto;

  @ApiProperty({ type: [PreparationStepDto], maxItems: MAX_DILUTION_STEPS })
  @IsArray({ message: 'List the dilution steps (possibly none).' })
  @ArrayMaxSize(MAX_DILUTION_STEPS, { message: `At most ${MAX_DILUTION_STEPS} dilution steps.` })
  @ValidateNested({ each: true })
  @Type(() => PreparationStepDto)
  steps: PreparationStepDto[];
}

export class CreatePreparationDto extends PreparationPreviewRequestDto {
  @ApiProperty({ example: 'Cadmium stock 1000 mg/L and working standards, 2026-12-04' })
  @RequiredText(160, 'Name the preparation.')
  name: string;
}
