import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post, Query } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  type CommentDto,
  type HistoryItemDto,
  type QueueItemDto,
  type ReviewQueueEntryDto,
  type ReviewQueuePageDto,
  Role,
  type SignatureDto,
  type StudyDiffDto,
  type TransitionResultDto,
} from '@meritline/shared';
import { CurrentUser, type AuthUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { SigningStep } from '../common/decorators/signing-step.decorator.js';
import { StudyDto } from '../studies/dto/study.dto.js';
import { ApiChange, ApiInvalid, ApiRecord, ApiSignedIn } from '../common/openapi/api-responses.js';
import { CommentsService } from './comments.service.js';
import {
  CommentResponseDto,
  HistoryItemResponseDto,
  ReviewQueuePageResponseDto,
  SignatureResponseDto,
  StudyDiffResponseDto,
  TransitionResultResponseDto,
} from './dto/review-response.dto.js';
import { CreateCommentDto } from './dto/create-comment.dto.js';
import { ReturnStudyDto } from './dto/return-study.dto.js';
import { ReviewQueueQueryDto } from './dto/review-queue.query.dto.js';
import { decodeCursor, encodeCursor } from '../common/keyset.js';
import { SignStudyDto } from './dto/sign-study.dto.js';
import { UpdateCommentDto } from './dto/update-comment.dto.js';
import { ReviewsService } from './reviews.service.js';
import { StudyHistoryService } from './study-history.service.js';
import { RunReleaseService } from '../runs/run-release.service.js';

const APPROVED = 'The study is approved: its comments no longer change.';
const REVIEWERS = [Role.Reviewer, Role.QualityManager];
const STUDY_READERS = [Role.Analyst, Role.Reviewer, Role.QualityManager];
/** Administrators read a study's record too (to hand a draft to another analyst), but do not comment. */
const STUDY_VIEWERS = [...STUDY_READERS, Role.Admin];

@ApiTags('reviews')
@ApiSignedIn()
@Controller('studies/:id')
export class StudyReviewController {
  constructor(
    private readonly reviewsService: ReviewsService,
    private readonly commentsService: CommentsService,
    private readonly historyService: StudyHistoryService,
  ) {}

  @SigningStep('submit', 'study', TransitionResultResponseDto, [Role.Analyst], 'Submitted, with the author’s signature.')
  submit(@Param('id', ParseUUIDPipe) id: string, @Body() dto: SignStudyDto, @CurrentUser() user: AuthUser): Promise<TransitionResultDto> {
    return this.reviewsService.submit(id, dto, user);
  }

  @SigningStep('return', 'study', TransitionResultResponseDto, REVIEWERS, 'Returned to the author with the comment.')
  returnToAuthor(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: ReturnStudyDto,
    @CurrentUser() user: AuthUser,
  ): Promise<TransitionResultDto> {
    return this.reviewsService.returnToAuthor(id, dto, user);
  }

  @SigningStep('approve', 'study', TransitionResultResponseDto, REVIEWERS, 'Approved (or reviewed, where a quality manager releases).')
  approve(@Param('id', ParseUUIDPipe) id: string, @Body() dto: SignStudyDto, @CurrentUser() user: AuthUser): Promise<TransitionResultDto> {
    return this.reviewsService.approve(id, dto, user);
  }

  @Post('copy')
  @Roles(Role.Analyst)
  @ApiCreatedResponse({ type: StudyDto, description: 'A new draft with the data of the study.' })
  @ApiRecord('study')
  copy(@Param('id', ParseUUIDPipe) id: string, @CurrentUser() user: AuthUser): Promise<StudyDto> {
    return this.reviewsService.copy(id, user);
  }

  @Get('signatures')
  @Roles(...STUDY_VIEWERS)
  @ApiOkResponse({ type: [SignatureResponseDto] })
  @ApiRecord('study')
  signatures(@Param('id', ParseUUIDPipe) id: string): Promise<SignatureDto[]> {
    return this.reviewsService.listSignatures(id);
  }

  @Get('history')
  @Roles(...STUDY_VIEWERS)
  @ApiOkResponse({ type: [HistoryItemResponseDto] })
  @ApiRecord('study')
  history(@Param('id', ParseUUIDPipe) id: string): Promise<HistoryItemDto[]> {
    return this.historyService.history(id);
  }

  @Get('diff')
  @Roles(...STUDY_VIEWERS)
  @ApiOkResponse({ type: StudyDiffResponseDto, description: 'What changed between the last two submissions; null before a resubmission.' })
  @ApiRecord('study')
  diff(@Param('id', ParseUUIDPipe) id: string): Promise<StudyDiffDto | null> {
    return this.historyService.diff(id);
  }

  @Get('comments')
  @Roles(...STUDY_VIEWERS)
  @ApiOkResponse({ type: [CommentResponseDto] })
  @ApiRecord('study')
  comments(@Param('id', ParseUUIDPipe) id: string): Promise<CommentDto[]> {
    return this.commentsService.list(id);
  }

  @Post('comments')
  @Roles(...STUDY_READERS)
  @ApiCreatedResponse({ type: CommentResponseDto })
  @ApiChange('study', APPROVED)
  comment(@Param('id', ParseUUIDPipe) id: string, @Body() dto: CreateCommentDto, @CurrentUser() user: AuthUser): Promise<CommentDto> {
    return this.commentsService.create(id, dto, user);
  }

  @Patch('comments/:commentId')
  @Roles(...STUDY_READERS)
  @ApiOkResponse({ type: CommentResponseDto })
  @ApiChange('study or comment', APPROVED)
  updateComment(
    @Param('id', ParseUUIDPipe) id: string,
    @Param('commentId', ParseUUIDPipe) commentId: string,
    @Body() dto: UpdateCommentDto,
    @CurrentUser() user: AuthUser,
  ): Promise<CommentDto> {
    return this.commentsService.setResolved(id, commentId, dto, user);
  }
}

@ApiTags('reviews')
@ApiSignedIn()
@Controller('reviews')
export class ReviewQueueController {
  constructor(
    private readonly reviewsService: ReviewsService,
    private readonly runRelease: RunReleaseService,
  ) {}

  /** Studies and runs awaiting the caller, each with its kind; studies first, each kind oldest first; paged forward by cursor. */
  @Get('queue')
  @Roles(...REVIEWERS)
  @ApiOkResponse({ type: ReviewQueuePageResponseDto })
  @ApiInvalid()
  async queue(@Query() query: ReviewQueueQueryDto, @CurrentUser() user: AuthUser): Promise<ReviewQueuePageDto> {
    const pageSize = query.pageSize ?? 50;
    const cursor = decodeCursor(query.cursor, ['study', 'run'], 'asc');
    const wanted = pageSize + 1;
    const items: ReviewQueueEntryDto[] = [];
    if (query.kind !== 'run' && cursor?.sort !== 'run') {
      const studies = await this.reviewsService.queueFor(user, { after: cursor?.id ?? null, limit: wanted });
      items.push(...studies.map((item: QueueItemDto) => ({ kind: 'study' as const, ...item })));
    }
    if (query.kind !== 'study' && items.length < wanted) {
      items.push(
        ...(await this.runRelease.queueFor(user, { after: cursor?.sort === 'run' ? cursor.id : null, limit: wanted - items.length })),
      );
    }
    const page = items.slice(0, pageSize);
    const last = page[page.length - 1];
    const nextCursor = items.length > pageSize ? encodeCursor({ id: last.id, dir: 'after', sort: last.kind, order: 'asc' }) : null;
    return { items: page, nextCursor, pageSize };
  }
}
