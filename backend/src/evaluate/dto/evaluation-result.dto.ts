import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { MODELS, type EvaluationResult } from '@meritline/shared';
import { described, describedList } from '../../common/openapi/api-responses.js';

const section = (description: string) => described(`${description} Null when the study has no such data.`, { nullable: true });

/** The engine’s result; each section’s fields are those of the shared result type (docs/statistics.md explains them). */
export class EvaluationResultDto implements EvaluationResult {
  @ApiProperty() engineVersion: string;
  @ApiProperty({ enum: MODELS }) model: EvaluationResult['model'];
  @ApiProperty(described('The weighting of the fit.')) weighting: EvaluationResult['weighting'];
  @ApiProperty({ description: 'Confidence level of every interval, e.g. 0.95.' }) confidence: number;
  @ApiProperty({ description: 'Significance level of every test.' }) alpha: number;
  @ApiProperty(described('{ x, y }: the concentration and response units.')) units: EvaluationResult['units'];
  @ApiProperty(section('The calibration fit: coefficients with their intervals, residuals, r².'))
  calibration: EvaluationResult['calibration'];
  @ApiProperty(section('Lack-of-fit F test.')) lackOfFit: EvaluationResult['lackOfFit'];
  @ApiProperty(section('Mandel’s fitting test.')) mandel: EvaluationResult['mandel'];
  @ApiProperty(section('Test of a zero intercept.')) interceptTest: EvaluationResult['interceptTest'];
  @ApiProperty(section('The fit through the origin.')) throughOrigin: EvaluationResult['throughOrigin'];
  @ApiProperty(section('Test of equal variances over the range.')) homoscedasticity: EvaluationResult['homoscedasticity'];
  @ApiProperty({ ...describedList('Unknowns read off the line, with their intervals and flags.'), nullable: true })
  unknowns: EvaluationResult['unknowns'];
  @ApiProperty({ ...describedList('Check standards against their tolerance.'), nullable: true }) checks: EvaluationResult['checks'];
  @ApiProperty(section('LOD and LOQ by each approach.')) detection: EvaluationResult['detection'];
  @ApiProperty(section('Recovery per level and overall.')) recovery: EvaluationResult['recovery'];
  @ApiProperty(section('Repeatability and intermediate precision.')) precision: EvaluationResult['precision'];
  @ApiProperty({ ...describedList('Points flagged by the outlier tests.'), nullable: true }) outliers: EvaluationResult['outliers'];
  @ApiProperty(section('The working range the data support.')) range: EvaluationResult['range'];
  @ApiProperty(described('Each criterion of the method against its figure, and the overall verdict.')) verdict: EvaluationResult['verdict'];
  @ApiProperty(describedList('What the engine noticed about the data, in words.')) warnings: EvaluationResult['warnings'];
  @ApiPropertyOptional(described('Measurement uncertainty budget (studies with that section).'))
  uncertainty?: EvaluationResult['uncertainty'];
  @ApiPropertyOptional(described('Accuracy profile (studies with that section).')) accuracyProfile?: EvaluationResult['accuracyProfile'];
  @ApiPropertyOptional(described('Trueness against a reference material (studies with that section).'))
  trueness?: EvaluationResult['trueness'];
}
