import { ApiProperty, OmitType, PickType } from '@nestjs/swagger';
import { MethodSummaryDto, MethodVersionDto, UserRefDto } from '../../methods/dto/method.dto.js';
import {
  IMPORT_SECTIONS,
  LIST_COUNT_CAP,
  STUDY_STATUSES,
  type ImportPreviewDto as ImportPreviewContract,
  type ImportSection,
  type StudyDto as StudyContract,
  type StudyMethod,
  type StudyMethodVersion,
  type StudyPageDto as StudyPageContract,
  type StudyStatus,
  type StudySummaryDto as StudySummaryContract,
} from '@meritline/shared';
import { StudyMetaDto } from './study-meta.dto.js';
import { FieldErrorDto } from '../../common/dto/api-error.dto.js';

export class StudyMethodDto extends OmitType(MethodSummaryDto, ['purpose'] as const) implements StudyMethod {}

export class StudyMethodVersionDto
  extends PickType(MethodVersionDto, ['id', 'number', 'status', 'criteria', 'settings'] as const)
  implements StudyMethodVersion {}

export class StudyDto implements Omit<StudyContract, 'result'> {
  @ApiProperty() id: string;
  @ApiProperty() title: string;
  @ApiProperty({ enum: STUDY_STATUSES }) status: StudyStatus;
  @ApiProperty() methodVersionId: string;
  @ApiProperty({ type: StudyMethodDto }) method: StudyMethodDto;
  @ApiProperty({ type: StudyMethodVersionDto }) methodVersion: StudyMethodVersionDto;
  @ApiProperty({ type: 'object', additionalProperties: true, description: 'The study in the engine’s input format, as stored.' })
  data: Record<string, unknown>;
  @ApiProperty({
    type: 'object',
    additionalProperties: true,
    nullable: true,
    description: 'The engine’s result for exactly `data`; null while the data cannot be evaluated yet.',
  })
  result: Record<string, unknown> | null;
  @ApiProperty({ type: [FieldErrorDto], nullable: true, description: 'Why `data` cannot be evaluated yet.' })
  resultErrors: FieldErrorDto[] | null;
  @ApiProperty() engineVersion: string;
  @ApiProperty({ description: 'SHA-256 (hex) of the canonical JSON of `data`.' }) dataHash: string;
  @ApiProperty({ type: StudyMetaDto }) meta: StudyMetaDto;
  @ApiProperty({ type: UserRefDto }) author: UserRefDto;
  @ApiProperty({ type: [String], description: 'Everyone who changed the data.' }) editorIds: string[];
  @ApiProperty({ type: String, nullable: true }) copiedFromId: string | null;
  @ApiProperty() lockVersion: number;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
  @ApiProperty({ format: 'date-time' }) updatedAt: string;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) submittedAt: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) approvedAt: string | null;
}

export class StudySummaryDto extends OmitType(StudyDto, ['data', 'result'] as const) implements StudySummaryContract {
  @ApiProperty({ type: Boolean, nullable: true, description: 'The verdict on the criteria; null without a result or criteria.' })
  verdictPass: boolean | null;
}

export class StudyPageDto implements StudyPageContract {
  @ApiProperty({ type: [StudySummaryDto] }) items: StudySummaryDto[];
  @ApiProperty({ type: String, nullable: true, description: 'Pass as cursor for the next page; null on the last page.' })
  nextCursor: string | null;
  @ApiProperty({ type: String, nullable: true, description: 'Pass as cursor for the page before; null on the first page.' })
  prevCursor: string | null;
  @ApiProperty({ description: `Matching studies, counted up to ${LIST_COUNT_CAP}.` }) total: number;
  @ApiProperty({ description: `True when more than ${LIST_COUNT_CAP} studies match (total is then a lower bound).` })
  totalIsCapped: boolean;
  @ApiProperty() pageSize: number;
}

export class ImportPreviewDto implements ImportPreviewContract {
  @ApiProperty({ enum: IMPORT_SECTIONS }) section: ImportSection;
  @ApiProperty({ type: [String], description: 'Column headers of the file.' }) columns: string[];
  @ApiProperty({ type: 'object', additionalProperties: { type: 'string' }, description: 'Target field → column header, as used.' })
  mapping: Record<string, string>;
  @ApiProperty({ type: 'array', items: {}, description: 'The section in the study format (lowSpikes: one object).' })
  rows: unknown[];
  @ApiProperty({ type: [FieldErrorDto], description: 'Per row and column, e.g. rows[3].y; a real import with any error saves nothing.' })
  errors: FieldErrorDto[];
  @ApiProperty({ description: 'Data rows read from the file.' }) rowCount: number;
}
