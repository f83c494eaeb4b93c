import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { createdFields, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { unprocessable } from '../common/validation.js';
import type { CreateCommentDto } from './dto/create-comment.dto.js';
import type { UpdateCommentDto } from './dto/update-comment.dto.js';
import { ReviewsService } from './reviews.service.js';
import { Role, type CommentDto } from '@meritline/shared';
import { writeTransaction } from '../database/write-transaction.js';
import { StudyComment } from './study-comment.entity.js';
import type { ValidationStudy } from '../studies/validation-study.entity.js';

export function toCommentDto(comment: StudyComment): CommentDto {
  return {
    id: comment.id,
    section: comment.section,
    threadId: comment.threadId,
    authorId: comment.authorId,
    authorName: comment.authorName,
    body: comment.body,
    resolved: comment.resolved,
    createdAt: comment.createdAt.toISOString(),
  };
}

@Injectable()
export class CommentsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly reviews: ReviewsService,
    private readonly audit: AuditService,
  ) {}

  async list(studyId: string): Promise<CommentDto[]> {
    await this.reviews.findStudy(studyId);
    return (await this.find(studyId)).map(toCommentDto);
  }

  find(studyId: string): Promise<StudyComment[]> {
    return this.dataSource.getRepository(StudyComment).find({ where: { studyId }, order: { createdAt: 'ASC' } });
  }

  /** Only the study's authors and its reviewers or quality managers take part in the discussion, and only until approval. */
  private async studyOpenFor(studyId: string, actor: AuthUser): Promise<ValidationStudy> {
    const study = await this.reviews.findStudy(studyId);
    const isAuthor = study.authorId === actor.id || (study.editorIds ?? []).includes(actor.id);
    const isReviewer = actor.roles.includes(Role.Reviewer) || actor.roles.includes(Role.QualityManager);
    if (!isAuthor && !isReviewer)
      throw new ForbiddenException('Only the authors of this study and its reviewers or quality managers can comment on it.');
    if (study.status === 'approved')
      throw new ConflictException('The study is approved: its comments can no longer be added, resolved or reopened.');
    return study;
  }

  async create(studyId: string, dto: CreateCommentDto, actor: AuthUser): Promise<CommentDto> {
    await this.studyOpenFor(studyId, actor);
    let section = dto.section;
    if (dto.threadId) {
      const thread = await this.dataSource.getRepository(StudyComment).findOneBy({ id: dto.threadId, studyId });
      if (!thread || thread.threadId) {
        throw unprocessable([
          { field: 'threadId', code: 'unknown_thread', message: 'There is no comment thread with this id on this study.' },
        ]);
      }
      section = thread.section;
    }
    return writeTransaction(this.dataSource, async (manager) => {
      const repo = manager.getRepository(StudyComment);
      const comment = await repo.save(
        repo.create({
          studyId,
          section,
          threadId: dto.threadId ?? null,
          authorId: actor.id,
          authorName: actor.name,
          body: dto.body.trim(),
          resolved: false,
        }),
      );
      await this.audit.record(
        {
          actor,
          action: 'study-comment.created',
          entity: 'study-comment',
          entityId: comment.id,
          changes: createdFields({ studyId, section, body: comment.body }),
        },
        manager,
      );
      return toCommentDto(comment);
    });
  }

  async setResolved(studyId: string, commentId: string, dto: UpdateCommentDto, actor: AuthUser): Promise<CommentDto> {
    await this.studyOpenFor(studyId, actor);
    return writeTransaction(this.dataSource, async (manager) => {
      const repo = manager.getRepository(StudyComment);
      const comment = await repo.findOneBy({ id: commentId, studyId });
      if (!comment) throw new NotFoundException('Comment not found on this study.');
      if (comment.resolved === dto.resolved) return toCommentDto(comment);
      await repo.update({ id: comment.id }, { resolved: dto.resolved });
      await this.audit.record(
        {
          actor,
          action: dto.resolved ? 'study-comment.resolved' : 'study-comment.reopened',
          entity: 'study-comment',
          entityId: comment.id,
          changes: { resolved: { from: comment.resolved, to: dto.resolved } },
        },
        manager,
      );
      return toCommentDto({ ...comment, resolved: dto.resolved });
    });
  }
}
