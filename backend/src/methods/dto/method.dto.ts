import { ApiProperty } from '@nestjs/swagger';
import {
  METHOD_CHANGE_KINDS,
  REVALIDATION_FAMILIES,
  type CriteriaTemplateDto as CriteriaTemplateContract,
  type MethodChangeKind,
  type MethodDto as MethodContract,
  type MethodSummaryDto as MethodSummaryContract,
  type MethodVersionDetailDto as MethodVersionDetailContract,
  type MethodVersionDto as MethodVersionContract,
  type MethodVersionSettings,
  type MethodVersionStatus,
  type RevalidationCoverage,
  type RevalidationFamily,
  type UserRef,
} from '@meritline/shared';
import { CriterionDto } from './criterion.dto.js';
import { VERSION_STATUSES } from './update-method-version.dto.js';

export class UserRefDto implements UserRef {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
}

export class MethodVersionSettingsViewDto implements MethodVersionSettings {
  @ApiProperty() requiresQualityRelease: boolean;
  @ApiProperty() checkTolerancePct: number;
  @ApiProperty() onePointMaxInterceptPct: number;
  @ApiProperty({ required: false, description: 'Percentage points within which mean recoveries count as equivalent (5 unless set).' })
  recoveryEquivalenceMarginPct?: number;
  @ApiProperty({ required: false, description: 'β of the accuracy profile (0.80 unless set).' }) accuracyBeta?: number;
  @ApiProperty({ required: false, description: 'Acceptance limits of the accuracy profile, ±λ % (10 unless set).' })
  accuracyLambdaPct?: number;
  @ApiProperty({ required: false, description: 'Coverage factor k of the expanded uncertainty (2 unless set).' }) coverageFactor?: number;
}

export class RevalidationCoverageDto implements RevalidationCoverage {
  @ApiProperty({ description: 'An approved study of this version shows every family in scope again (always true for an empty scope).' })
  covered: boolean;
  @ApiProperty({
    enum: REVALIDATION_FAMILIES,
    isArray: true,
    description: 'Families in scope that no approved study of this version shows.',
  })
  missing: RevalidationFamily[];
  @ApiProperty({ nullable: true, type: String, description: 'The approved study that covers the scope.' }) studyId: string | null;
}

export class MethodVersionDto implements MethodVersionContract {
  @ApiProperty() id: string;
  @ApiProperty() number: number;
  @ApiProperty({ enum: VERSION_STATUSES }) status: MethodVersionStatus;
  @ApiProperty() changeSummary: string;
  @ApiProperty({ enum: METHOD_CHANGE_KINDS, nullable: true, description: 'Null for the first version of a method.' })
  changeKind: MethodChangeKind | null;
  @ApiProperty({ enum: REVALIDATION_FAMILIES, isArray: true }) revalidationScope: RevalidationFamily[];
  @ApiProperty({ type: RevalidationCoverageDto }) coverage: RevalidationCoverageDto;
  @ApiProperty({ nullable: true, type: String, description: 'Why a quality manager activated the version without a covering study.' })
  activationJustification: string | null;
  @ApiProperty({ type: [CriterionDto] }) criteria: CriterionDto[];
  @ApiProperty({ type: MethodVersionSettingsViewDto }) settings: MethodVersionSettingsViewDto;
  @ApiProperty() lockVersion: number;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ type: UserRefDto }) createdBy: UserRefDto;
  @ApiProperty({ description: 'Validation studies on this version.' }) studyCount: number;
  @ApiProperty({ description: 'Approved validation studies on this version.' }) approvedStudyCount: number;
}

export class MethodSummaryDto implements MethodSummaryContract {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() analyte: string;
  @ApiProperty() matrix: string;
  @ApiProperty() technique: string;
  @ApiProperty() xUnit: string;
  @ApiProperty() yUnit: string;
  @ApiProperty({ description: 'Key of the criteria template the method started from.' }) purpose: string;
}

export class MethodDto extends MethodSummaryDto implements MethodContract {
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ type: [MethodVersionDto], description: 'Sorted by number.' }) versions: MethodVersionDto[];
}

export class MethodVersionDetailDto extends MethodVersionDto implements MethodVersionDetailContract {
  @ApiProperty({ type: MethodSummaryDto }) method: MethodSummaryDto;
}

export class CriteriaTemplateDto implements CriteriaTemplateContract {
  @ApiProperty({ example: 'assay' }) key: string;
  @ApiProperty({ example: 'Assay of a major component' }) name: string;
  @ApiProperty() description: string;
  @ApiProperty({ type: [CriterionDto] }) criteria: CriterionDto[];
  @ApiProperty({ type: MethodVersionSettingsViewDto, description: 'Typical settings for this purpose.' })
  settings: MethodVersionSettingsViewDto;
  @ApiProperty({ description: 'Where the thresholds come from (common practice) and the cautions that go with them.' }) note: string;
}
