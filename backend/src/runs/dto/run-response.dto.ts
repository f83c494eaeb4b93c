import { ApiProperty, ApiPropertyOptional, OmitType, PickType } from '@nestjs/swagger';
import {
  IMPORT_MAPPING_FIELDS,
  QC_SERIES,
  Role,
  RUN_REVIEW_STATUSES,
  type ImportMappingColumns,
  type ImportMappingDto,
  type QcBaselineDto,
  type QcSeries,
  type QcTrendsDto,
  type RunReviewDto,
  type RunReviewStatus,
  type RunSignatureDto,
  type RunSignatureMeaning,
  type RunStatus,
  type RunControlChartDto,
  type RunDto,
  type RunMethodChoiceDto,
  type RunMethodDto,
  type RunOptionsDto,
  type RunPageDto,
  type RunPreviewDto,
  type RunSummaryDto,
  RUN_MODELS,
  type RunModel,
  type RunRecordedData,
} from '@meritline/shared';
import { described, describedList } from '../../common/openapi/api-responses.js';
import { MethodSummaryDto, UserRefDto } from '../../methods/dto/method.dto.js';

const RUN_STATUSES: RunStatus[] = ['accepted', 'rejected'];
const VERSION_STATUSES = ['draft', 'active', 'retired'] as const;
type VersionStatus = (typeof VERSION_STATUSES)[number];

export class RunMethodResponseDto extends OmitType(MethodSummaryDto, ['technique', 'purpose'] as const) implements RunMethodDto {}

class RunMethodRefDto extends PickType(RunMethodResponseDto, ['id', 'name', 'analyte'] as const) {}

export class RunResponseDto implements RunDto {
  @ApiProperty() id: string;
  @ApiProperty() methodVersionId: string;
  @ApiProperty() versionNumber: number;
  @ApiProperty({ type: RunMethodResponseDto }) method: RunMethodResponseDto;
  @ApiProperty() title: string;
  @ApiProperty({ enum: RUN_STATUSES, description: 'The check-standard verdict.' }) status: RunStatus;
  @ApiProperty({ enum: RUN_MODELS }) model: RunModel;
  @ApiProperty(described('The run’s measurements as entered, with the units, weighting and confidence level used.')) data: RunRecordedData;
  @ApiProperty(described('The calculation: calibration, unknowns with their flags, checks, blanks, QC samples, uncertainty.'))
  result: RunDto['result'];
  @ApiProperty({ type: [String] }) rejectionReasons: string[];
  @ApiProperty() engineVersion: string;
  @ApiProperty({ description: 'SHA-256 (hex) of the canonical JSON of `data`.' }) dataHash: string;
  @ApiProperty({ type: UserRefDto }) author: UserRefDto;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
}

export class RunPreviewResponseDto
  extends PickType(RunResponseDto, ['status', 'result', 'rejectionReasons', 'data'] as const)
  implements RunPreviewDto {}

export class RunSummaryResponseDto implements RunSummaryDto {
  @ApiProperty() id: string;
  @ApiProperty() title: string;
  @ApiProperty({ enum: RUN_STATUSES }) status: RunStatus;
  @ApiProperty({ enum: RUN_REVIEW_STATUSES }) reviewStatus: RunReviewStatus;
  @ApiProperty({ enum: RUN_MODELS }) model: RunModel;
  @ApiProperty() methodVersionId: string;
  @ApiProperty() versionNumber: number;
  @ApiProperty({ type: RunMethodRefDto }) method: RunMethodRefDto;
  @ApiProperty({ type: UserRefDto }) author: UserRefDto;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ type: Number, nullable: true }) slope: number | null;
  @ApiProperty() unknownCount: number;
  @ApiProperty() checkCount: number;
}

export class RunPageResponseDto implements RunPageDto {
  @ApiProperty({ type: [RunSummaryResponseDto] }) items: RunSummaryResponseDto[];
  @ApiProperty({ type: String, nullable: true, description: 'Pass as cursor for the next page; null on the last page.' })
  nextCursor: string | null;
  @ApiProperty({ type: String, nullable: true, description: 'Pass as cursor for the page before; null on the first page.' })
  prevCursor: string | null;
  @ApiProperty({ description: 'Matching runs, counted up to the list cap.' }) total: number;
  @ApiProperty({ description: 'True when more runs match than the cap counts (total is then a lower bound).' }) totalIsCapped: boolean;
  @ApiProperty() pageSize: number;
}

class VersionChoiceDto {
  @ApiProperty() id: string;
  @ApiProperty() number: number;
  @ApiProperty({ enum: VERSION_STATUSES }) status: VersionStatus;
  @ApiProperty() usable: boolean;
  @ApiProperty({ type: String, nullable: true, description: 'Why no run may be made on the version.' }) reason: string | null;
}

export class MethodChoiceResponseDto extends RunMethodResponseDto implements RunMethodChoiceDto {
  @ApiProperty({ type: [VersionChoiceDto] }) versions: VersionChoiceDto[];
}

export class RunOptionsResponseDto implements RunOptionsDto {
  @ApiProperty() methodVersionId: string;
  @ApiProperty() lockVersion: number;
  @ApiProperty() versionNumber: number;
  @ApiProperty({ enum: VERSION_STATUSES }) status: VersionStatus;
  @ApiProperty({ type: RunMethodResponseDto }) method: RunMethodResponseDto;
  @ApiProperty({ description: 'False when no run may be made on the version; `reason` says why.' }) usable: boolean;
  @ApiProperty({ type: String, nullable: true }) reason: string | null;
  @ApiProperty(describedList('The calibration models the validation allows, each with why or why not.')) models: RunOptionsDto['models'];
  @ApiProperty({ type: String, nullable: true }) validationStudyId: string | null;
  @ApiProperty({ type: Number, nullable: true }) lod: number | null;
  @ApiProperty({ type: Number, nullable: true }) loq: number | null;
  @ApiProperty(described('The validated range: { low, high, unit }.', { nullable: true })) validatedRange: RunOptionsDto['validatedRange'];
  @ApiProperty() checkTolerancePct: number;
  @ApiProperty() onePointMaxInterceptPct: number;
  @ApiProperty(described('The validation the runs rest on.', { nullable: true })) validation: RunOptionsDto['validation'];
  @ApiProperty(described('The recovery window QC samples must meet: { low, high, basis }.')) qcWindow: RunOptionsDto['qcWindow'];
}

export class RunControlChartResponseDto implements RunControlChartDto {
  @ApiProperty() methodVersionId: string;
  @ApiProperty() slopeUnit: string;
  @ApiProperty(describedList('One point per accepted run: its slope and the rules it breaks.')) points: RunControlChartDto['points'];
  @ApiProperty({ type: Number, nullable: true }) mean: number | null;
  @ApiProperty({ type: Number, nullable: true }) sd: number | null;
  @ApiProperty(described('{ warning: [low, high], action: [low, high] }', { nullable: true })) limits: RunControlChartDto['limits'];
  @ApiProperty() n: number;
  @ApiProperty({ type: String, nullable: true }) message: string | null;
}

export class RunSignatureResponseDto implements RunSignatureDto {
  @ApiProperty() id: string;
  @ApiProperty() signerId: string;
  @ApiProperty() signerName: string;
  @ApiProperty({ enum: Role }) signerRole: Role;
  @ApiProperty({ enum: ['performed', 'reviewed-and-released'] }) meaning: RunSignatureMeaning;
  @ApiProperty({ format: 'date-time' }) signedAt: string;
  @ApiProperty() contentHash: string;
  @ApiProperty({ description: 'The signed content still matches the run as stored.' }) valid: boolean;
}

export class RunReviewResponseDto implements RunReviewDto {
  @ApiProperty() runId: string;
  @ApiProperty({ enum: RUN_REVIEW_STATUSES }) reviewStatus: RunReviewStatus;
  @ApiProperty() lockVersion: number;
  @ApiProperty() authorId: string;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) submittedAt: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) releasedAt: string | null;
  @ApiProperty({ type: String, nullable: true }) returnComment: string | null;
  @ApiProperty({ type: String, nullable: true }) supersedesId: string | null;
  @ApiProperty({ type: String, nullable: true }) supersededById: string | null;
  @ApiProperty({ type: String, nullable: true }) supersedeReason: string | null;
  @ApiProperty({ type: [RunSignatureResponseDto] }) signatures: RunSignatureResponseDto[];
}

class ImportMappingColumnsResponseDto implements ImportMappingColumns {
  @ApiProperty() sampleId: string;
  @ApiProperty() sampleType: string;
  @ApiProperty() response: string;
  @ApiProperty({ type: String, nullable: true }) replicate: string | null;
  @ApiProperty({ type: String, nullable: true }) dilution: string | null;
  @ApiProperty({ type: String, nullable: true }) concentration: string | null;
}

export class ImportMappingResponseDto implements ImportMappingDto {
  @ApiProperty() methodVersionId: string;
  @ApiProperty({
    type: ImportMappingColumnsResponseDto,
    nullable: true,
    description: `Column header per field (${IMPORT_MAPPING_FIELDS.join(', ')}); null until saved.`,
  })
  columns: ImportMappingColumnsResponseDto | null;
  @ApiProperty({ description: '0 while none is saved.' }) lockVersion: number;
  @ApiProperty({ type: String, nullable: true }) updatedBy: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) updatedAt: string | null;
}

/** { status: 'needs-mapping', columns, preview } or { status: 'parsed', columns, data, rows }. */
export class InstrumentImportResponseDto {
  @ApiProperty({ enum: ['needs-mapping', 'parsed'] }) status: 'needs-mapping' | 'parsed';
  @ApiProperty({ type: [String] }) columns: string[];
  @ApiPropertyOptional({ type: 'array', items: { type: 'array', items: {} }, description: 'needs-mapping: the first rows as read.' })
  preview?: (string | number | null)[][];
  @ApiPropertyOptional(described('parsed: { standards, checks, unknowns, blanks, qcSamples } in the shape a new run takes.'))
  data?: Record<string, unknown>;
  @ApiPropertyOptional({ description: 'parsed: data rows read.' }) rows?: number;
}

export class QcBaselineResponseDto implements QcBaselineDto {
  @ApiProperty() methodVersionId: string;
  @ApiProperty({ type: [String] }) runIds: string[];
  @ApiProperty({ type: UserRefDto }) chosenBy: UserRefDto;
  @ApiProperty({ format: 'date-time' }) chosenAt: string;
  @ApiProperty() reason: string;
  @ApiProperty() lockVersion: number;
}

export class QcTrendsResponseDto implements QcTrendsDto {
  @ApiProperty() methodId: string;
  @ApiProperty() methodName: string;
  @ApiProperty() methodVersionId: string;
  @ApiProperty() versionNumber: number;
  @ApiProperty({ enum: QC_SERIES }) series: QcSeries;
  @ApiProperty() seriesLabel: string;
  @ApiProperty() unit: string;
  @ApiProperty({ type: QcBaselineResponseDto, nullable: true }) baseline: QcBaselineResponseDto | null;
  @ApiProperty(described('{ n, mean, sd, warning: [low, high], action: [low, high] }', { nullable: true })) limits: QcTrendsDto['limits'];
  @ApiProperty(describedList('{ runId, runTitle, createdAt, item, value, baseline, signals }')) points: QcTrendsDto['points'];
  @ApiProperty(describedList('{ rule, message, runId, runTitle, item, createdAt }')) signals: QcTrendsDto['signals'];
  @ApiProperty({ type: String, nullable: true, description: 'Why there are no limits, in words.' }) message: string | null;
}
