import { ApiProperty } from '@nestjs/swagger';
import type { MethodVersionStatus } from '@meritline/shared';
import { CriterionDto } from './criterion.dto.js';
import { VERSION_STATUSES } from './update-method-version.dto.js';

export class UserRefDto {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
}

export class MethodVersionSettingsViewDto {
  @ApiProperty() requiresQualityRelease: boolean;
  @ApiProperty() checkTolerancePct: number;
  @ApiProperty() onePointMaxInterceptPct: number;
}

export class MethodVersionDto {
  @ApiProperty() id: string;
  @ApiProperty() number: number;
  @ApiProperty({ enum: VERSION_STATUSES }) status: MethodVersionStatus;
  @ApiProperty() changeSummary: string;
  @ApiProperty({ type: [CriterionDto] }) criteria: CriterionDto[];
  @ApiProperty({ type: MethodVersionSettingsViewDto }) settings: MethodVersionSettingsViewDto;
  @ApiProperty() lockVersion: number;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ type: UserRefDto }) createdBy: UserRefDto;
  @ApiProperty({ description: 'Validation studies on this version.' }) studyCount: number;
  @ApiProperty({ description: 'Approved validation studies on this version.' }) approvedStudyCount: number;
}

export class MethodSummaryDto {
  @ApiProperty() id: string;
  @ApiProperty() name: string;
  @ApiProperty() analyte: string;
  @ApiProperty() matrix: string;
  @ApiProperty() technique: string;
  @ApiProperty() xUnit: string;
  @ApiProperty() yUnit: string;
  @ApiProperty({ description: 'Key of the criteria template the method started from.' }) purpose: string;
}

export class MethodDto extends MethodSummaryDto {
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ type: [MethodVersionDto], description: 'Sorted by number.' }) versions: MethodVersionDto[];
}

export class MethodVersionDetailDto extends MethodVersionDto {
  @ApiProperty({ type: MethodSummaryDto }) method: MethodSummaryDto;
}

export class CriteriaTemplateDto {
  @ApiProperty({ example: 'assay' }) key: string;
  @ApiProperty({ example: 'Assay of a major component' }) name: string;
  @ApiProperty() description: string;
  @ApiProperty({ type: [CriterionDto] }) criteria: CriterionDto[];
  @ApiProperty({ type: MethodVersionSettingsViewDto, description: 'Typical settings for this purpose.' })
  settings: MethodVersionSettingsViewDto;
  @ApiProperty({ description: 'Where the thresholds come from (common practice) and the cautions that go with them.' }) note: string;
}
