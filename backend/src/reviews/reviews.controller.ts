import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
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
import type { StudyDto } from '../studies/dto/study.dto.js';
import { CommentsService } from './comments.service.js';
import { CreateCommentDto } from './dto/create-comment.dto.js';
import { ReturnStudyDto } from './dto/return-study.dto.js';
import { ReviewQueueQueryDto } from './dto/review-queue.query.dto.js';
import { decodeCursor, encodeCursor } from '../common/keyset.js';
import { SignStudyDto } from './dto/sign-study.dto.js';
import { UpdateCommentDto } from './dto/update-comment.dto.js';
import { ReviewsService } from './reviews.service.js';
import { StudyHistoryService } from './study-history.service.js';
import { RunReleaseService } from '../runs/run-release.service.js';

const STUDY_READERS = [Role.Analyst, Role.Reviewer, Role.QualityManager];
/** Administrators read a study's record too (to hand a draft to another analyst), but do not comment. */
const STUDY_VIEWERS = [...STUDY_READERS, Role.Admin];

@ApiTags('reviews')
@ApiBearerAuth()
@Controller('studies/:id')
export class StudyReviewController {
  constructor(
    private readonly reviewsService: ReviewsService,
    private readonly commentsService: CommentsService,
    private readonly historyService: StudyHistoryService,
  ) {}

  @Post('submit')
  @HttpCode(200)
  @Roles(Role.Analyst)
  submit(@Param('id', ParseUUIDPipe) id: string, @Body() dto: SignStudyDto, @CurrentUser() user: AuthUser): Promise<TransitionResultDto> {
    return this.reviewsService.submit(id, dto, user);
  }

  @Post('return')
  @HttpCode(200)
  @Roles(Role.Reviewer, Role.QualityManager)
  returnToAuthor(
    @Param('id', ParseUUIDPipe) id: string,
    @Body() dto: ReturnStudyDto,
    @CurrentUser() user: AuthUser,
  ): Promise<TransitionResultDto> {
    return this.reviewsService.returnToAuthor(id, dto, user);
  }

  @Post('approve')
  @HttpCode(200)
  @Roles(Role.Reviewer, Role.QualityManager)
  approve(@Param('id', ParseUUIDPipe) id: string, @Body() dto: SignStudyDto, @CurrentUser() user: AuthUser): Promise<TransitionResultDto> {
    return this.reviewsService.approve(id, dto, user);
  }

  @Post('copy')
  @Roles(Role.Analyst)
  copy(@Param('id', ParseUUIDPipe) id: string, @CurrentUser() user: AuthUser): Promise<StudyDto> {
    return this.reviewsService.copy(id, user);
  }

  @Get('signatures')
  @Roles(...STUDY_VIEWERS)
  signatures(@Param('id', ParseUUIDPipe) id: string): Promise<SignatureDto[]> {
    return this.reviewsService.listSignatures(id);
  }

  @Get('history')
  @Roles(...STUDY_VIEWERS)
  history(@Param('id', ParseUUIDPipe) id: string): Promise<HistoryItemDto[]> {
    return this.historyService.history(id);
  }

  @Get('diff')
  @Roles(...STUDY_VIEWERS)
  diff(@Param('id', ParseUUIDPipe) id: string): Promise<StudyDiffDto | null> {
    return this.historyService.diff(id);
  }

  @Get('comments')
  @Roles(...STUDY_VIEWERS)
  comments(@Param('id', ParseUUIDPipe) id: string): Promise<CommentDto[]> {
    return this.commentsService.list(id);
  }

  @Post('comments')
  @Roles(...STUDY_READERS)
  comment(@Param('id', ParseUUIDPipe) id: string, @Body() dto: CreateCommentDto, @CurrentUser() user: AuthUser): Promise<CommentDto> {
    return this.commentsService.create(id, dto, user);
  }

  @Patch('comments/:commentId')
  @Roles(...STUDY_READERS)
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
@ApiBearerAuth()
@Controller('reviews')
export class ReviewQueueController {
  constructor(
    private readonly reviewsService: ReviewsService,
    private readonly runRelease: RunReleaseService,
  ) {}

  /** Studies and runs awaiting the caller, each with its kind; studies first, each kind oldest first; paged forward by cursor. */
  @Get('queue')
  @Roles(Role.Reviewer, Role.QualityManager)
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
