import { ApiProperty } from '@nestjs/swagger';
import type {
  ComparedVersion,
  DetectionComparison,
  FigureComparison,
  MethodTrendPoint,
  MethodTrendResponse,
  RangeComparison,
  Unavailable,
  VersionChangeRow,
  VersionComparisonResponse,
  VersionComparisonTests,
} from '@meritline/shared';

const free = (description: string) => ({ type: 'object', additionalProperties: true, description }) as const;

export class MethodRefDto {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() xUnit: string;
  @ApiProperty() yUnit: string;
}

export class ComparedVersionDto implements ComparedVersion {
  @ApiProperty() versionId: string;
  @ApiProperty() number: number;
  @ApiProperty({ enum: ['draft', 'active', 'retired'] }) status: ComparedVersion['status'];
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ nullable: true, type: String, description: 'Null when the version has no approved study.' }) studyId: string | null;
  @ApiProperty({ nullable: true, type: String }) studyTitle: string | null;
  @ApiProperty({ nullable: true, type: String }) studyStatus: ComparedVersion['studyStatus'];
  @ApiProperty({ nullable: true, type: String, format: 'date-time' }) approvedAt: string | null;
}

export class VersionChangeRowDto implements VersionChangeRow {
  @ApiProperty() aspect: string;
  @ApiProperty({ nullable: true, type: String }) from: string | null;
  @ApiProperty({ nullable: true, type: String }) to: string | null;
  @ApiProperty() changed: boolean;
}

export class VersionComparisonDto implements VersionComparisonResponse {
  @ApiProperty({ type: MethodRefDto }) method: MethodRefDto;
  @ApiProperty({ type: ComparedVersionDto }) from: ComparedVersionDto;
  @ApiProperty({ type: ComparedVersionDto }) to: ComparedVersionDto;
  @ApiProperty({ description: 'Significance level of every test: the later study’s α.' }) alpha: number;
  @ApiProperty({ description: 'Equivalence margin of the mean recoveries, percentage points.' }) recoveryMarginPct: number;
  @ApiProperty({ type: [VersionChangeRowDto] }) changes: VersionChangeRowDto[];
  @ApiProperty({ type: 'array', items: free('{ figure, label, from, to, difference, ratio, criterionFrom, criterionTo }') })
  figures: FigureComparison[];
  @ApiProperty(
    free(
      '{ slope, intercept, residualSd, repeatability, intermediatePrecision, recovery: { welch, tost, verdict } }; a test that cannot be made is { available: false, reason }.',
    ),
  )
  tests: VersionComparisonTests;
  @ApiProperty({ type: 'array', items: free('LOD/LOQ of one approach in both versions, their ratio and the LOQ criterion.') })
  detection: DetectionComparison[];
  @ApiProperty(free('Working range of both versions and the levels gained or lost, or { available: false, reason }.'))
  range: RangeComparison | Unavailable;
  @ApiProperty({ type: [String], description: 'What the comparison lacks, in words; empty when complete.' }) missing: string[];
}

export class MethodTrendPointDto implements MethodTrendPoint {
  @ApiProperty() versionId: string;
  @ApiProperty() number: number;
  @ApiProperty({ enum: ['draft', 'active', 'retired'] }) status: MethodTrendPoint['status'];
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ nullable: true, type: String }) studyId: string | null;
  @ApiProperty({ nullable: true, type: String, format: 'date-time' }) approvedAt: string | null;
  @ApiProperty({ nullable: true, type: Number }) slope: number | null;
  @ApiProperty({ nullable: true, type: [Number], description: '[low, high] at the study’s confidence.' }) slopeCi: [number, number] | null;
  @ApiProperty({ nullable: true, type: Number }) loq: number | null;
  @ApiProperty({ nullable: true, type: String }) loqBasis: string | null;
  @ApiProperty({ nullable: true, type: Number }) rsdR: number | null;
  @ApiProperty({ nullable: true, type: Number }) rsdI: number | null;
  @ApiProperty({ nullable: true, type: Number }) meanRecoveryPct: number | null;
  @ApiProperty({ nullable: true, type: [Number] }) meanRecoveryCi: [number, number] | null;
}

export class MethodTrendDto implements MethodTrendResponse {
  @ApiProperty({ type: MethodRefDto }) method: MethodRefDto;
  @ApiProperty({ type: [MethodTrendPointDto], description: 'One point per version, by number; figures null without an approved study.' })
  points: MethodTrendPointDto[];
}
