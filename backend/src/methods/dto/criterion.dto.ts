import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, Matches, MaxLength, ValidateBy, type ValidationArguments } from 'class-validator';
import { CRITERION_OPS, type CriterionDefinition, type CriterionOp } from '@meritline/shared';
import { OptionalText } from './text.decorators.js';

const RESULT_SECTIONS = [
  'calibration',
  'lackOfFit',
  'mandel',
  'interceptTest',
  'throughOrigin',
  'homoscedasticity',
  'unknowns',
  'checks',
  'detection',
  'recovery',
  'precision',
  'outliers',
  'range',
  'accuracyProfile',
  'trueness',
  'uncertainty',
];
const FIGURE_PATTERN = new RegExp(`^(${RESULT_SECTIONS.join('|')})(\\.[A-Za-z0-9_-]+|\\[[A-Za-z0-9_-]+\\])+$`);

const isFiniteNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value);

function validThreshold(value: unknown, args: ValidationArguments): boolean {
  if ((args.object as CriterionDto).op !== 'between') return isFiniteNumber(value);
  return Array.isArray(value) && value.length === 2 && value.every(isFiniteNumber) && value[0] <= value[1];
}

/** One acceptance criterion in the engine's format; `level` and `label` describe it for people. */
export class CriterionDto implements CriterionDefinition {
  @ApiProperty({ example: 'calibration.r2', description: 'Dotted path into the evaluation result, e.g. recovery.overall.meanPct.' })
  @IsString()
  @MaxLength(120)
  @Matches(FIGURE_PATTERN, { message: 'Name a figure of the evaluation result, e.g. calibration.r2 or recovery.overall.meanPct.' })
  figure: string;

  @ApiProperty({ enum: CRITERION_OPS })
  @IsIn(CRITERION_OPS, { message: `The comparison must be one of ${CRITERION_OPS.join(', ')}.` })
  op: CriterionOp;

  @ApiProperty({
    oneOf: [{ type: 'number' }, { type: 'array', items: { type: 'number' }, minItems: 2, maxItems: 2 }],
    example: 0.995,
    description: 'A number, or [low, high] for between.',
  })
  @ValidateBy({
    name: 'criterionThreshold',
    validator: {
      validate: validThreshold,
      defaultMessage: (args) =>
        (args?.object as CriterionDto | undefined)?.op === 'between'
          ? 'Give the range as [low, high] with low at most high.'
          : 'Give the threshold as a number.',
    },
  })
  value: number | [number, number];

  @ApiPropertyOptional({ oneOf: [{ type: 'string' }, { type: 'number' }], description: 'The level the criterion concerns, for display.' })
  @IsOptional()
  @ValidateBy({
    name: 'criterionLevel',
    validator: {
      validate: (value: unknown) => (typeof value === 'string' && value.length <= 40) || isFiniteNumber(value),
      defaultMessage: () => 'The level must be a text of at most 40 characters or a number.',
    },
  })
  level?: string | number;

  @ApiPropertyOptional({ example: 'Coefficient of determination r² at least 0.995' })
  @OptionalText(200)
  label?: string;
}
