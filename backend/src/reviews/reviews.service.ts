import { ConflictException, ForbiddenException, Injectable, Logger, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, In, Repository, type EntityManager } from 'typeorm';
import {
  MIN_JUSTIFICATION_LENGTH,
  type QueueItemDto,
  type ReviewStage,
  Role,
  type SignatureDto,
  type SignatureMeaning,
  type StudyStatus,
  type TransitionResultDto,
} from '@meritline/shared';
import { createdFields, AuditService } from '../audit/audit.service.js';
import { AuthService } from '../auth/auth.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { keysetPage, QUEUE_BATCH, type KeysetCursor, type QueuePage } from '../common/keyset.js';
import { unprocessable } from '../common/validation.js';
import { writeTransaction } from '../database/write-transaction.js';
import { ReportsService } from '../reports/reports.service.js';
import type { StudyDto } from '../studies/dto/study.dto.js';
import { toStudyDto } from '../studies/studies.service.js';
import { WorkerPoolService } from '../workers/worker-pool.service.js';
import { newDraftFields, ValidationStudy } from '../studies/validation-study.entity.js';
import type { ReturnStudyDto } from './dto/return-study.dto.js';
import type { SignStudyDto } from './dto/sign-study.dto.js';
import { ReviewNoticesService, type ReviewEvent } from './review-notices.service.js';
import { contentHash, currentRound, failsCriteria, toSignatureDtos } from './signatures.js';
import { StudySignature } from './study-signature.entity.js';

const STATUS_WORDS: Record<StudyStatus, string> = { draft: 'a draft', submitted: 'submitted', returned: 'returned', approved: 'approved' };

export const WRONG_PASSWORD = 'Password not correct; nothing was signed.';

interface Transition {
  study: ValidationStudy;
  actor: AuthUser;
  to: StudyStatus;
  action: string;
  reason: string | null;
  set?: Partial<Pick<ValidationStudy, 'submittedAt' | 'approvedAt'>>;
  signature?: { meaning: SignatureMeaning; role: Role; at: Date; justification?: string | null };
  event: ReviewEvent;
}

@Injectable()
export class ReviewsService {
  private readonly logger = new Logger(ReviewsService.name);

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(ValidationStudy) private readonly studies: Repository<ValidationStudy>,
    @InjectRepository(StudySignature) private readonly signatures: Repository<StudySignature>,
    private readonly auth: AuthService,
    private readonly audit: AuditService,
    private readonly notices: ReviewNoticesService,
    private readonly reports: ReportsService,
    private readonly workers: WorkerPoolService,
  ) {}

  async findStudy(id: string): Promise<ValidationStudy> {
    const study = await this.studies.findOne({ where: { id }, relations: { methodVersion: { method: true }, author: true } });
    if (!study) throw new NotFoundException('Study not found.');
    return study;
  }

  async listSignatures(studyId: string): Promise<SignatureDto[]> {
    const study = await this.findStudy(studyId);
    return toSignatureDtos(await this.signaturesOf(study.id), study);
  }

  async submit(studyId: string, dto: SignStudyDto, actor: AuthUser): Promise<TransitionResultDto> {
    const study = await this.findStudy(studyId);
    if (study.authorId !== actor.id) throw new ForbiddenException('Only the author of this study can submit it for review.');
    this.assertFresh(study, dto.lockVersion);
    if (study.status !== 'draft' && study.status !== 'returned') {
      throw new ConflictException(`This study is ${STATUS_WORDS[study.status]}; only a draft or a returned study can be submitted.`);
    }
    if (!study.result) {
      const errors = study.resultErrors?.length
        ? study.resultErrors
        : [{ field: 'data', code: 'no_result', message: 'The results have not been computed yet.' }];
      throw unprocessable(errors, 'The results cannot be computed from the data yet, so the study cannot be submitted.');
    }
    await this.verifyPassword(study, actor, dto.password, 'authored');
    const at = new Date();
    return this.apply({
      study,
      actor,
      to: 'submitted',
      action: 'study.submitted',
      reason: dto.comment?.trim() || null,
      set: { submittedAt: at },
      signature: { meaning: 'authored', role: Role.Analyst, at },
      event: 'submitted',
    });
  }

  async returnToAuthor(studyId: string, dto: ReturnStudyDto, actor: AuthUser): Promise<TransitionResultDto> {
    const study = await this.findStudy(studyId);
    if (study.authorId === actor.id) throw new ForbiddenException('You wrote this study; another reviewer must check it.');
    this.assertFresh(study, dto.lockVersion);
    if (study.status !== 'submitted')
      throw new ConflictException(`This study is ${STATUS_WORDS[study.status]}; only a submitted study can be returned.`);
    return this.apply({ study, actor, to: 'returned', action: 'study.returned', reason: dto.comment.trim(), event: 'returned' });
  }

  /** First approval by a second person; where the method version asks for it, a release by a third (a quality manager). */
  async approve(studyId: string, dto: SignStudyDto, actor: AuthUser): Promise<TransitionResultDto> {
    const study = await this.findStudy(studyId);
    if (study.authorId === actor.id || study.editorIds.includes(actor.id)) {
      throw new ForbiddenException('You authored or edited this study, so you cannot approve it: a second person must review it.');
    }
    this.assertFresh(study, dto.lockVersion);
    if (study.status !== 'submitted')
      throw new ConflictException(`This study is ${STATUS_WORDS[study.status]}; only a submitted study can be approved.`);

    const firstApproval = currentRound(await this.signaturesOf(study.id)).find((s) => s.meaning === 'reviewed-and-approved');
    const releaseRequired = study.methodVersion.settings?.requiresQualityRelease === true;
    const reason = dto.comment?.trim() || null;
    const justification = this.justificationFor(study, dto.justification);
    const at = new Date();
    if (!firstApproval) {
      await this.verifyPassword(study, actor, dto.password, 'reviewed-and-approved');
      const role = actor.roles.includes(Role.Reviewer) ? Role.Reviewer : Role.QualityManager;
      const signature = { meaning: 'reviewed-and-approved' as const, role, at, justification };
      return releaseRequired
        ? this.apply({ study, actor, to: 'submitted', action: 'study.review-approved', reason, signature, event: 'release-pending' })
        : this.apply({
            study,
            actor,
            to: 'approved',
            action: 'study.approved',
            reason,
            set: { approvedAt: at },
            signature,
            event: 'approved',
          });
    }
    if (!actor.roles.includes(Role.QualityManager))
      throw new ForbiddenException('This study has been reviewed and now awaits release by a quality manager.');
    if (firstApproval.signerId === actor.id)
      throw new ForbiddenException('You approved this study as its reviewer; a different quality manager must release it.');
    await this.verifyPassword(study, actor, dto.password, 'released');
    return this.apply({
      study,
      actor,
      to: 'approved',
      action: 'study.released',
      reason,
      set: { approvedAt: at },
      signature: { meaning: 'released', role: Role.QualityManager, at, justification },
      event: 'approved',
    });
  }

  /** A new draft with the same data on the same method version, evaluated by the current engine. */
  async copy(studyId: string, actor: AuthUser): Promise<StudyDto> {
    const source = await this.findStudy(studyId);
    if (source.methodVersion.status === 'retired') {
      throw unprocessable(
        [
          {
            field: 'methodVersionId',
            code: 'retired',
            message: `Version ${source.methodVersion.number} of ${source.methodVersion.method.name} is retired; start a new study on the method's current version.`,
          },
        ],
        'A study cannot be started on a retired method version.',
      );
    }
    const evaluation = await this.workers.evaluate(source.data);
    const id = await writeTransaction(this.dataSource, async (manager) => {
      const repo = manager.getRepository(ValidationStudy);
      const copy = await repo.save(
        repo.create({
          methodVersionId: source.methodVersionId,
          title: `${source.title} (new study)`.slice(0, 200),
          data: source.data,
          ...evaluation,
          meta: source.meta?.instrument ? { instrument: source.meta.instrument } : {},
          copiedFromId: source.id,
          ...newDraftFields(actor.id),
        }),
      );
      await this.audit.record(
        {
          actor,
          action: 'study.created',
          entity: 'study',
          entityId: copy.id,
          changes: createdFields({ status: 'draft', copiedFromId: source.id }),
          reason: `Started from the study “${source.title}”.`,
        },
        manager,
      );
      return copy.id;
    });
    return toStudyDto(await this.findStudy(id));
  }

  /**
   * Up to `limit` submitted studies the user may act on, oldest first, after the study `after`. Read by keyset in
   * batches without data or result; the author and editors are left out row by row.
   */
  async queueFor(user: AuthUser, page: QueuePage): Promise<QueueItemDto[]> {
    const isManager = user.roles.includes(Role.QualityManager);
    const items: QueueItemDto[] = [];
    let cursor: KeysetCursor | null = page.after ? { id: page.after, dir: 'after', sort: 'study', order: 'asc' } : null;
    do {
      const qb = this.studies
        .createQueryBuilder('study')
        .innerJoin('study.methodVersion', 'version')
        .innerJoin('version.method', 'method')
        .innerJoin('study.author', 'author')
        .select([
          'study.id',
          'study.title',
          'study.status',
          'study.methodVersionId',
          'study.authorId',
          'study.editorIds',
          'study.submittedAt',
          'study.lockVersion',
          'version.id',
          'version.number',
          'version.methodId',
          'method.id',
          'method.name',
          'author.id',
          'author.name',
        ])
        .where('study.status = :status', { status: 'submitted' });
      const batch = await keysetPage(qb, {
        alias: 'study',
        sortProperty: 'submittedAt',
        sort: 'study',
        order: 'asc',
        cursor,
        pageSize: QUEUE_BATCH,
        countQuery: null,
      });
      const ids = batch.rows.map((s) => s.id);
      const signatures = ids.length ? await this.signatures.find({ where: { studyId: In(ids) } }) : [];
      for (const study of batch.rows) {
        if (study.authorId === user.id || study.editorIds.includes(user.id)) continue;
        const firstApproval = currentRound(signatures.filter((s) => s.studyId === study.id)).find(
          (s) => s.meaning === 'reviewed-and-approved',
        );
        const stage: ReviewStage = firstApproval ? 'release' : 'review';
        if (stage === 'release' && (!isManager || firstApproval?.signerId === user.id)) continue;
        items.push({
          id: study.id,
          title: study.title,
          status: study.status,
          stage,
          methodId: study.methodVersion.methodId,
          methodName: study.methodVersion.method.name,
          methodVersionId: study.methodVersionId,
          methodVersionNumber: study.methodVersion.number,
          authorId: study.authorId,
          authorName: study.author.name,
          submittedAt: study.submittedAt?.toISOString() ?? null,
          lockVersion: study.lockVersion,
        });
        if (items.length >= page.limit) return items;
      }
      cursor = batch.nextCursor ? { id: batch.rows[batch.rows.length - 1].id, dir: 'after', sort: 'study', order: 'asc' } : null;
    } while (cursor);
    return items;
  }

  signaturesOf(studyId: string): Promise<StudySignature[]> {
    return this.signatures.find({ where: { studyId }, order: { signedAt: 'ASC' } });
  }

  /** A study that does not meet all its criteria is approved only with a written reason; one that does needs none. */
  private justificationFor(study: ValidationStudy, given: string | undefined): string | null {
    if (!failsCriteria(study.result)) return given?.trim() || null;
    const text = given?.trim() ?? '';
    if (text.length >= MIN_JUSTIFICATION_LENGTH) return text;
    const message = `This study does not meet all its acceptance criteria: write why it may be approved all the same (at least ${MIN_JUSTIFICATION_LENGTH} characters).`;
    throw unprocessable([{ field: 'justification', code: text ? 'too_short' : 'required', message }], message);
  }

  private assertFresh(study: ValidationStudy, lockVersion: number | undefined) {
    if (lockVersion !== undefined && lockVersion !== study.lockVersion) {
      throw new ConflictException('This study changed since you opened it; reload it, check it again and retry.');
    }
  }

  private async verifyPassword(study: ValidationStudy, actor: AuthUser, password: string, meaning: SignatureMeaning) {
    if (await this.auth.verifyPassword(actor.id, password)) return;
    await this.audit.signatureRefused(actor, { entity: 'study', entityId: study.id, meaning });
    throw new UnauthorizedException(WRONG_PASSWORD);
  }

  /**
   * One transaction: the status moves only if nobody moved it first (the UPDATE is guarded by the
   * lock version read before the password check), and the signature, audit entries and notices commit with it.
   */
  private async apply(transition: Transition): Promise<TransitionResultDto> {
    const { study, actor, to, action, reason, signature } = transition;
    let deliver: () => Promise<void> = async () => {};
    let signed: StudySignature | null = null;
    const updated = await writeTransaction(this.dataSource, async (manager) => {
      const result = await manager
        .createQueryBuilder()
        .update(ValidationStudy)
        .set({ status: to, ...transition.set, lockVersion: () => 'lock_version + 1' })
        .where('id = :id AND lock_version = :lockVersion', { id: study.id, lockVersion: study.lockVersion })
        .execute();
      if (result.affected !== 1)
        throw new ConflictException('Someone else acted on this study at the same moment; reload it to see its current state.');
      const justification = signature?.justification ? `Justification: ${signature.justification}` : null;
      const detail = [reason, justification].filter(Boolean).join(' ') || null;
      await this.audit.record(
        { actor, action, entity: 'study', entityId: study.id, changes: { status: { from: study.status, to } }, reason: detail },
        manager,
      );
      if (signature) signed = await this.sign(manager, study, actor, signature, reason);
      deliver = await this.notices.prepare(transition.event, study, actor, reason, manager);
      return manager.getRepository(ValidationStudy).findOneByOrFail({ id: study.id });
    });
    await deliver();
    if (updated.status === 'approved') await this.issueReport(study.id, actor);
    const all = await this.signaturesOf(study.id);
    return {
      id: updated.id,
      status: updated.status,
      stage:
        updated.status !== 'submitted' ? null : currentRound(all).some((s) => s.meaning === 'reviewed-and-approved') ? 'release' : 'review',
      lockVersion: updated.lockVersion,
      submittedAt: updated.submittedAt?.toISOString() ?? null,
      approvedAt: updated.approvedAt?.toISOString() ?? null,
      signature: signed ? (toSignatureDtos(all, updated).find((s) => s.id === signed?.id) ?? null) : null,
    };
  }

  /** The approval stands even if the report fails; the report page issues it again on first download. */
  private async issueReport(studyId: string, actor: AuthUser) {
    try {
      await this.reports.issueForStudy(studyId, actor);
    } catch (error) {
      this.logger.error(`The signed report of study ${studyId} could not be issued: ${(error as Error).stack ?? String(error)}`);
    }
  }

  private async sign(
    manager: EntityManager,
    study: ValidationStudy,
    actor: AuthUser,
    signature: NonNullable<Transition['signature']>,
    comment: string | null,
  ): Promise<StudySignature> {
    const repo = manager.getRepository(StudySignature);
    const authored = signature.meaning === 'authored';
    const saved = await repo.save(
      repo.create({
        studyId: study.id,
        signerId: actor.id,
        signerName: actor.name,
        signerRole: signature.role,
        meaning: signature.meaning,
        signedAt: signature.at,
        contentHash: contentHash(study),
        comment,
        justification: signature.justification ?? null,
        dataSnapshot: authored ? study.data : null,
        resultSnapshot: authored ? study.result : null,
        metaSnapshot: authored ? { ...study.meta, title: study.title } : null,
      }),
    );
    await this.audit.record(
      {
        actor,
        action: `signature.${signature.meaning}`,
        entity: 'study-signature',
        entityId: saved.id,
        changes: {
          studyId: { from: null, to: study.id },
          signerRole: { from: null, to: signature.role },
          contentHash: { from: null, to: saved.contentHash },
          ...(saved.justification ? { justification: { from: null, to: saved.justification } } : {}),
        },
        reason: comment,
      },
      manager,
    );
    return saved;
  }
}
