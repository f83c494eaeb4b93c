import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  AUDIT_RECORD_KINDS,
  type AuditBreakDto,
  type AuditPersonDto,
  type AuditRecordKind,
  type AuditReviewDto,
  type AuditReviewScope,
  type AuditTrailEntryDto,
  type AuditTrailPageDto,
} from '@meritline/shared';
import { UserRefDto } from '../../methods/dto/method.dto.js';
import { described } from '../../common/openapi/api-responses.js';

class ChangeInWordsDto {
  @ApiProperty() field: string;
  @ApiProperty() from: string;
  @ApiProperty() to: string;
}

export class AuditTrailEntryResponseDto implements AuditTrailEntryDto {
  @ApiProperty() seq: number;
  @ApiProperty({ format: 'date-time' }) at: string;
  @ApiProperty({ type: String, nullable: true }) actorId: string | null;
  @ApiProperty() actorName: string;
  @ApiProperty() action: string;
  @ApiProperty() actionText: string;
  @ApiProperty() entity: string;
  @ApiProperty({ type: String, nullable: true }) entityId: string | null;
  @ApiProperty() recordText: string;
  @ApiProperty(described('Field → { from, to }, for programs.', { nullable: true })) changes: AuditTrailEntryDto['changes'];
  @ApiProperty({ type: [ChangeInWordsDto] }) changesInWords: ChangeInWordsDto[];
  @ApiProperty({ type: String, nullable: true }) reason: string | null;
}

class AuditRecordRefDto {
  @ApiProperty({ enum: AUDIT_RECORD_KINDS }) kind: AuditRecordKind;
  @ApiProperty() id: string;
  @ApiProperty() name: string;
}

export class AuditTrailPageResponseDto implements AuditTrailPageDto {
  @ApiProperty({ type: [AuditTrailEntryResponseDto] }) items: AuditTrailEntryResponseDto[];
  @ApiProperty({ description: 'Entries matching the filters over every page, counted up to the list cap.' }) total: number;
  @ApiProperty({ description: 'True when more entries match than the cap counts (total is then a lower bound).' }) totalIsCapped: boolean;
  @ApiProperty({ type: Number, nullable: true, description: 'Pass as `cursor` for the next (older) page.' }) nextCursor: number | null;
  @ApiProperty({ type: Number, nullable: true }) page: number | null;
  @ApiProperty() pageSize: number;
  @ApiProperty({ type: AuditRecordRefDto, nullable: true }) record: AuditRecordRefDto | null;
}

export class AuditPersonResponseDto extends UserRefDto implements AuditPersonDto {}

class AuditBreakResponseDto implements AuditBreakDto {
  @ApiProperty() seq: number;
  @ApiProperty() reason: string;
}

/** Either { ok: true, rows } or { ok: false, rows, brokenAt, reason, broken }. */
export class AuditVerificationResponseDto {
  @ApiProperty({ description: 'The whole chain hashes as stored.' }) ok: boolean;
  @ApiProperty() rows: number;
  @ApiPropertyOptional({ description: 'The first entry that does not hash (when not ok).' }) brokenAt?: number;
  @ApiPropertyOptional() reason?: string;
  @ApiPropertyOptional({ type: [AuditBreakResponseDto] }) broken?: AuditBreakResponseDto[];
}

export class AuditReviewResponseDto implements AuditReviewDto {
  @ApiProperty() id: string;
  @ApiProperty({ enum: ['period', 'record'] }) scope: AuditReviewScope;
  @ApiProperty({ type: String, format: 'date', nullable: true }) periodFrom: string | null;
  @ApiProperty({ type: String, format: 'date', nullable: true }) periodTo: string | null;
  @ApiProperty({ enum: AUDIT_RECORD_KINDS, nullable: true }) recordKind: AuditRecordKind | null;
  @ApiProperty({ type: String, nullable: true }) recordId: string | null;
  @ApiProperty() subject: string;
  @ApiProperty() reviewerId: string;
  @ApiProperty() reviewerName: string;
  @ApiProperty({ format: 'date-time' }) reviewedAt: string;
  @ApiProperty({ type: String, nullable: true }) comment: string | null;
  @ApiProperty({ description: 'The newest entry that existed when the review was signed.' }) lastSeq: number;
  @ApiProperty() entries: number;
  @ApiProperty() chainIntact: boolean;
}
