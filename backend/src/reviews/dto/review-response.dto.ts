import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import {
  Role,
  RUN_REVIEW_STATUSES,
  STUDY_SECTIONS,
  STUDY_STATUSES,
  type CommentDto,
  type FieldChanges,
  type HistoryItemDto,
  type HistoryKind,
  type ReviewQueueEntryDto,
  type ReviewQueuePageDto,
  type ReviewStage,
  type RunReviewStatus,
  type SectionDiff,
  type SignatureDto,
  type SignatureMeaning,
  type StudyDiffDto,
  type StudySection,
  type StudyStatus,
  type TransitionResultDto,
} from '@meritline/shared';
import { described, describedList } from '../../common/openapi/api-responses.js';

const STAGES: ReviewStage[] = ['review', 'release'];

export class SignatureResponseDto implements SignatureDto {
  @ApiProperty() id: string;
  @ApiProperty() signerId: string;
  @ApiProperty() signerName: string;
  @ApiProperty({ enum: Role }) signerRole: Role;
  @ApiProperty({ enum: ['authored', 'reviewed-and-approved', 'released'] }) meaning: SignatureMeaning;
  @ApiProperty({ format: 'date-time' }) signedAt: string;
  @ApiProperty({ description: 'SHA-256 (hex) of the content signed.' }) contentHash: string;
  @ApiProperty({ type: String, nullable: true }) comment: string | null;
  @ApiPropertyOptional({ type: String, nullable: true, description: 'Why the signer approved although criteria are not met.' })
  justification?: string | null;
  @ApiProperty({ description: 'The content still hashes to `contentHash`.' }) valid: boolean;
  @ApiProperty({ description: 'Part of a submission that was returned or resubmitted.' }) superseded: boolean;
}

export class TransitionResultResponseDto implements TransitionResultDto {
  @ApiProperty() id: string;
  @ApiProperty({ enum: STUDY_STATUSES }) status: StudyStatus;
  @ApiProperty({ enum: STAGES, nullable: true }) stage: ReviewStage | null;
  @ApiProperty() lockVersion: number;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) submittedAt: string | null;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) approvedAt: string | null;
  @ApiProperty({ type: SignatureResponseDto, nullable: true }) signature: SignatureResponseDto | null;
}

export class CommentResponseDto implements CommentDto {
  @ApiProperty() id: string;
  @ApiProperty({ enum: STUDY_SECTIONS }) section: StudySection;
  @ApiProperty({ type: String, nullable: true }) threadId: string | null;
  @ApiProperty() authorId: string;
  @ApiProperty() authorName: string;
  @ApiProperty() body: string;
  @ApiProperty() resolved: boolean;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
}

export class HistoryItemResponseDto implements HistoryItemDto {
  @ApiProperty() id: string;
  @ApiProperty({ format: 'date-time' }) at: string;
  @ApiProperty({ enum: ['status', 'signature', 'comment', 'record'] }) kind: HistoryKind;
  @ApiProperty() action: string;
  @ApiProperty() actorName: string;
  @ApiProperty() summary: string;
  @ApiProperty({ type: String, nullable: true }) detail: string | null;
  @ApiProperty(described('Field → { from, to }.', { nullable: true })) changes: FieldChanges | null;
  @ApiPropertyOptional({ type: [String], description: 'Each change in words, before and after.' }) lines?: string[];
  @ApiPropertyOptional() valid?: boolean;
}

class SignatureRefDto {
  @ApiProperty() signatureId: string;
  @ApiProperty({ format: 'date-time' }) signedAt: string;
}

export class StudyDiffResponseDto implements StudyDiffDto {
  @ApiProperty({ type: SignatureRefDto }) from: SignatureRefDto;
  @ApiProperty({ type: SignatureRefDto }) to: SignatureRefDto;
  @ApiProperty(describedList('[{ field, from, to }]')) settings: StudyDiffDto['settings'];
  @ApiProperty(describedList('Per section: rows added, removed and changed (key, field, from, to).')) sections: SectionDiff[];
  @ApiProperty(describedList('Title, conclusion and other record fields that changed: [{ field, from, to }].')) meta: StudyDiffDto['meta'];
}

/** A study ({ kind: 'study', stage }) or a run ({ kind: 'run', verdict }) awaiting the caller. */
export class ReviewQueueEntryResponseDto {
  @ApiProperty({ enum: ['study', 'run'] }) kind: 'study' | 'run';
  @ApiProperty() id: string;
  @ApiProperty() title: string;
  @ApiProperty({ enum: [...STUDY_STATUSES, ...RUN_REVIEW_STATUSES] }) status: StudyStatus | RunReviewStatus;
  @ApiPropertyOptional({ enum: STAGES, description: 'Studies.' }) stage?: ReviewStage;
  @ApiPropertyOptional({ enum: ['accepted', 'rejected'], description: 'Runs: the check-standard verdict.' }) verdict?:
    'accepted' | 'rejected';
  @ApiProperty() methodId: string;
  @ApiProperty() methodName: string;
  @ApiProperty() methodVersionId: string;
  @ApiProperty() methodVersionNumber: number;
  @ApiProperty() authorId: string;
  @ApiProperty() authorName: string;
  @ApiProperty({ type: String, format: 'date-time', nullable: true }) submittedAt: string | null;
  @ApiProperty() lockVersion: number;
}

export class ReviewQueuePageResponseDto implements ReviewQueuePageDto {
  @ApiProperty({ type: [ReviewQueueEntryResponseDto] }) items: ReviewQueueEntryDto[];
  @ApiProperty({ type: String, nullable: true, description: 'Pass as `cursor` for the next page; null on the last page.' })
  nextCursor: string | null;
  @ApiProperty() pageSize: number;
}
