import { ConflictException, ForbiddenException, Injectable, Logger, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, type EntityManager } from 'typeorm';
import {
  Role,
  RunReviewStatus,
  RUN_REVIEW_STATUS_LABELS,
  type RunDto,
  type RunQueueItemDto,
  type RunReviewDto,
  type RunSignatureMeaning,
} from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import { AuthService } from '../auth/auth.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { keysetPage, QUEUE_BATCH, type KeysetCursor, type QueuePage } from '../common/keyset.js';
import { unprocessable } from '../common/validation.js';
import { writeTransaction } from '../database/write-transaction.js';
import { MailService, type Letter } from '../mail/mail.service.js';
import { NotificationsService } from '../notifications/notifications.service.js';
import { User } from '../users/user.entity.js';
import { UsersService } from '../users/users.service.js';
import type { ReturnRunDto, SignRunDto, SupersedeRunDto } from './dto/run-signing.dto.js';
import { runContentHash, saveCalculatedRun } from './run-record.js';
import { RunSignature } from './run-signature.entity.js';
import { Run } from './run.entity.js';
import { QcTrendsService } from './qc-trends.service.js';
import { RunsService } from './runs.service.js';

export const WRONG_RUN_PASSWORD = 'Password not correct; nothing was signed.';

type RunReviewFields = Partial<
  Pick<Run, 'reviewStatus' | 'submittedAt' | 'releasedAt' | 'returnComment' | 'supersededById' | 'supersedeReason'>
>;

type RunEvent = 'submitted' | 'returned' | 'released' | 'superseded';

const statusWords = (run: Run) => RUN_REVIEW_STATUS_LABELS[run.reviewStatus].toLowerCase();

/** Submission, second-person release, return and correction of routine runs. */
@Injectable()
export class RunReleaseService {
  private readonly logger = new Logger(RunReleaseService.name);

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly runsService: RunsService,
    private readonly auth: AuthService,
    private readonly audit: AuditService,
    private readonly users: UsersService,
    private readonly mail: MailService,
    private readonly notifications: NotificationsService,
    private readonly qcTrends: QcTrendsService,
  ) {}

  private async findRun(id: string): Promise<Run> {
    const run = await this.dataSource.getRepository(Run).findOne({ where: { id } });
    if (!run) throw new NotFoundException('Run not found.');
    return run;
  }

  async review(id: string): Promise<RunReviewDto> {
    const run = await this.findRun(id);
    const signatures = await this.dataSource.getRepository(RunSignature).find({ where: { runId: id }, order: { signedAt: 'ASC' } });
    const hash = runContentHash(run);
    return {
      runId: run.id,
      reviewStatus: run.reviewStatus,
      lockVersion: run.lockVersion,
      authorId: run.authorId,
      submittedAt: run.submittedAt?.toISOString() ?? null,
      releasedAt: run.releasedAt?.toISOString() ?? null,
      returnComment: run.returnComment,
      supersedesId: run.supersedesId,
      supersededById: run.supersededById,
      supersedeReason: run.supersedeReason,
      signatures: signatures.map((s) => ({
        id: s.id,
        signerId: s.signerId,
        signerName: s.signerName,
        signerRole: s.signerRole,
        meaning: s.meaning,
        signedAt: s.signedAt.toISOString(),
        contentHash: s.contentHash,
        valid: s.contentHash === hash,
      })),
    };
  }

  async submit(id: string, dto: SignRunDto, actor: AuthUser): Promise<RunReviewDto> {
    const run = await this.findRun(id);
    if (run.authorId !== actor.id) throw new ForbiddenException('Only the analyst who performed this run can submit it.');
    this.assertOpen(run);
    this.assertFresh(run, dto.version);
    if (run.reviewStatus !== RunReviewStatus.Calculated && run.reviewStatus !== RunReviewStatus.Returned) {
      throw new ConflictException(`This run is ${statusWords(run)}; only a calculated or returned run can be submitted.`);
    }
    await this.verifyPassword(run, actor, dto.password, 'performed');
    const at = new Date();
    await this.apply(run, actor, RunReviewStatus.Submitted, 'run.submitted', null, { submittedAt: at, returnComment: null }, 'submitted', {
      meaning: 'performed',
      role: Role.Analyst,
      at,
    });
    return this.review(id);
  }

  async release(id: string, dto: SignRunDto, actor: AuthUser): Promise<RunReviewDto> {
    const run = await this.findRun(id);
    if (run.authorId === actor.id)
      throw new ForbiddenException('You performed this run, so you cannot release it: a second person must review it.');
    this.assertOpen(run);
    this.assertFresh(run, dto.version);
    if (run.reviewStatus !== RunReviewStatus.Submitted) {
      throw new ConflictException(`This run is ${statusWords(run)}; only a submitted run can be released.`);
    }
    if (run.status === 'rejected') {
      const message = `This run was rejected by its check standards, so its results cannot be released: ${run.rejectionReasons.join(' ')} Return it to the analyst instead.`;
      throw unprocessable([{ field: 'status', code: 'rejected', message }], message);
    }
    await this.verifyPassword(run, actor, dto.password, 'reviewed-and-released');
    const at = new Date();
    await this.apply(run, actor, RunReviewStatus.Released, 'run.released', null, { releasedAt: at }, 'released', {
      meaning: 'reviewed-and-released',
      role: Role.Reviewer,
      at,
    });
    // A control-chart signal must never undo a release; the chart shows it again on the next look.
    await this.qcTrends
      .afterRelease(run.methodVersionId)
      .catch((error: Error) => this.logger.error(`Control-chart check failed: ${error.message}`));
    return this.review(id);
  }

  async returnToAnalyst(id: string, dto: ReturnRunDto, actor: AuthUser): Promise<RunReviewDto> {
    const run = await this.findRun(id);
    if (run.authorId === actor.id) throw new ForbiddenException('You performed this run; another reviewer must check it.');
    this.assertOpen(run);
    this.assertFresh(run, dto.version);
    if (run.reviewStatus !== RunReviewStatus.Submitted) {
      throw new ConflictException(`This run is ${statusWords(run)}; only a submitted run can be returned.`);
    }
    await this.verifyPassword(run, actor, dto.password, null);
    const comment = dto.comment.trim();
    await this.apply(run, actor, RunReviewStatus.Returned, 'run.returned', comment, { returnComment: comment }, 'returned');
    return this.review(id);
  }

  /** A correction run on the same method version; the released run stays, marked as replaced, with the reason on both. */
  async supersede(id: string, dto: SupersedeRunDto, actor: AuthUser): Promise<RunDto> {
    const old = await this.findRun(id);
    if (old.reviewStatus === RunReviewStatus.Superseded) {
      throw new ConflictException('This run has already been replaced by a correction; correct the newest run instead.');
    }
    if (old.reviewStatus !== RunReviewStatus.Released) {
      throw new ConflictException(`This run is ${statusWords(old)}, not released: change it through review instead of a correction.`);
    }
    if (dto.methodVersionId !== old.methodVersionId) {
      const message = 'A correction run must use the same method version as the run it replaces.';
      throw unprocessable([{ field: 'methodVersionId', code: 'not_same_version', message }], message);
    }
    const reason = dto.reason.trim();
    const evaluation = await this.runsService.preview(dto);
    let deliver: () => Promise<void> = async () => {};
    const createdId = await writeTransaction(this.dataSource, async (manager) => {
      const saved = await saveCalculatedRun(manager, this.audit, {
        methodVersionId: old.methodVersionId,
        title: dto.title.trim(),
        evaluation,
        author: actor,
        createdAt: new Date(),
        supersedes: { id: old.id, reason },
      });
      await this.guardedUpdate(manager, old, {
        reviewStatus: RunReviewStatus.Superseded,
        supersededById: saved.id,
        supersedeReason: reason,
      });
      await this.audit.record(
        {
          actor,
          action: 'run.superseded',
          entity: 'run',
          entityId: old.id,
          changes: {
            reviewStatus: { from: old.reviewStatus, to: RunReviewStatus.Superseded },
            supersededById: { from: null, to: saved.id },
          },
          reason,
        },
        manager,
      );
      deliver = await this.prepareNotices('superseded', old, actor, reason, manager);
      return saved.id;
    });
    await deliver();
    return this.runsService.findOne(createdId);
  }

  /** Results leave Meritline only from a released run that its check standards accepted. */
  async assertReportable(id: string): Promise<void> {
    const run = await this.findRun(id);
    if (run.reviewStatus === RunReviewStatus.Superseded) {
      throw new ConflictException('This run was replaced by a correction; export the correction run once it is released.');
    }
    if (run.reviewStatus !== RunReviewStatus.Released) {
      throw new ConflictException(
        `This run is ${statusWords(run)}; results can be exported only after a second person has released the run.`,
      );
    }
    if (run.status !== 'accepted') {
      throw new ConflictException('This run was rejected by its check standards; its results cannot be reported.');
    }
  }

  /** Submitted runs a reviewer may release: everyone's but their own, oldest first. */
  /** Up to `limit` submitted runs the reviewer did not write, oldest first, after the run `after`; read by keyset in batches. */
  async queueFor(user: AuthUser, page: QueuePage): Promise<RunQueueItemDto[]> {
    if (!user.roles.includes(Role.Reviewer)) return [];
    const mine: Run[] = [];
    let cursor: KeysetCursor | null = page.after ? { id: page.after, dir: 'after', sort: 'run', order: 'asc' } : null;
    do {
      const qb = this.dataSource
        .getRepository(Run)
        .createQueryBuilder('run')
        .innerJoin('run.methodVersion', 'version')
        .innerJoin('version.method', 'method')
        .select([
          'run.id',
          'run.title',
          'run.status',
          'run.reviewStatus',
          'run.methodVersionId',
          'run.authorId',
          'run.submittedAt',
          'run.lockVersion',
          'version.id',
          'version.number',
          'version.methodId',
          'method.id',
          'method.name',
        ])
        .where('run.reviewStatus = :reviewStatus', { reviewStatus: RunReviewStatus.Submitted });
      const batch = await keysetPage(qb, {
        alias: 'run',
        sortProperty: 'submittedAt',
        sort: 'run',
        order: 'asc',
        cursor,
        pageSize: QUEUE_BATCH,
        countQuery: null,
      });
      mine.push(...batch.rows.filter((run) => run.authorId !== user.id));
      cursor = batch.nextCursor ? { id: batch.rows[batch.rows.length - 1].id, dir: 'after', sort: 'run', order: 'asc' } : null;
    } while (cursor && mine.length < page.limit);
    const runs = mine.slice(0, page.limit);
    const authorIds = [...new Set(runs.map((run) => run.authorId))];
    const authors = authorIds.length
      ? await this.dataSource.getRepository(User).find({ where: { id: In(authorIds) }, select: { id: true, name: true } })
      : [];
    const names = new Map(authors.map((a) => [a.id, a.name]));
    return runs.map((run) => ({
      kind: 'run',
      id: run.id,
      title: run.title,
      status: run.reviewStatus,
      verdict: run.status,
      methodId: run.methodVersion.methodId,
      methodName: run.methodVersion.method.name,
      methodVersionId: run.methodVersionId,
      methodVersionNumber: run.methodVersion.number,
      authorId: run.authorId,
      authorName: names.get(run.authorId) ?? 'Unknown user',
      submittedAt: run.submittedAt?.toISOString() ?? null,
      lockVersion: run.lockVersion,
    }));
  }

  private assertOpen(run: Run) {
    if (run.reviewStatus === RunReviewStatus.Released) {
      throw new ConflictException('This run is already released and locked; a change needs a correction run.');
    }
    if (run.reviewStatus === RunReviewStatus.Superseded) {
      throw new ConflictException('This run was replaced by a correction and is locked.');
    }
  }

  private assertFresh(run: Run, version: number) {
    if (version !== run.lockVersion)
      throw new ConflictException('This run changed since you opened it; reload it, check it again and retry.');
  }

  private async verifyPassword(run: Run, actor: AuthUser, password: string, meaning: RunSignatureMeaning | null) {
    if (await this.auth.verifyPassword(actor.id, password)) return;
    await this.audit.signatureRefused(actor, { entity: 'run', entityId: run.id, meaning: meaning ?? 'returned' });
    throw new UnauthorizedException(WRONG_RUN_PASSWORD);
  }

  private async guardedUpdate(manager: EntityManager, run: Run, set: RunReviewFields) {
    const result = await manager
      .createQueryBuilder()
      .update(Run)
      .set({ ...set, lockVersion: () => 'lock_version + 1' })
      .where('id = :id AND lock_version = :lockVersion', { id: run.id, lockVersion: run.lockVersion })
      .execute();
    if (result.affected !== 1)
      throw new ConflictException('Someone else acted on this run at the same moment; reload it to see its current state.');
  }

  /** Status, signature, audit entry and in-app notices commit together; e-mails go out after the commit. */
  private async apply(
    run: Run,
    actor: AuthUser,
    to: RunReviewStatus,
    action: string,
    reason: string | null,
    set: RunReviewFields,
    event: RunEvent,
    signature?: { meaning: RunSignatureMeaning; role: Role; at: Date },
  ) {
    let deliver: () => Promise<void> = async () => {};
    await writeTransaction(this.dataSource, async (manager) => {
      await this.guardedUpdate(manager, run, { reviewStatus: to, ...set });
      await this.audit.record(
        { actor, action, entity: 'run', entityId: run.id, changes: { reviewStatus: { from: run.reviewStatus, to } }, reason },
        manager,
      );
      if (signature) {
        const repo = manager.getRepository(RunSignature);
        await repo.save(
          repo.create({
            runId: run.id,
            signerId: actor.id,
            signerName: actor.name,
            signerRole: signature.role,
            meaning: signature.meaning,
            signedAt: signature.at,
            contentHash: runContentHash(run),
          }),
        );
      }
      deliver = await this.prepareNotices(event, run, actor, reason, manager);
    });
    await deliver();
  }

  private async prepareNotices(event: RunEvent, run: Run, actor: AuthUser, comment: string | null, manager: EntityManager) {
    const path = `/runs/${run.id}`;
    const link = this.mail.link(path);
    const title = `“${run.title}”`;
    const mails: Letter[] = [];
    let recipients: User[];
    let message: string;
    if (event === 'submitted') {
      recipients = (await this.users.findActiveWithRole(Role.Reviewer)).filter((user) => user.id !== run.authorId);
      message = `${actor.name} submitted the run ${title} for release.`;
      for (const to of recipients) {
        mails.push({
          to,
          subject: `Run awaiting release: ${run.title}`,
          lines: [
            `${actor.name} performed the routine run ${title}, signed it and submitted it for release.`,
            '',
            `Open it to review: ${link}`,
          ],
        });
      }
    } else {
      const author = await this.users.findById(run.authorId);
      recipients = author.id === actor.id ? [] : [author];
      const texts = {
        returned: {
          message: `${actor.name} returned the run ${title}: ${comment ?? ''}`,
          subject: `Run returned: ${run.title}`,
          line: `${actor.name} returned the routine run ${title} to you with this comment:\n\n  ${comment ?? ''}`,
        },
        released: {
          message: `${actor.name} released the run ${title}.`,
          subject: `Run released: ${run.title}`,
          line: `${actor.name} reviewed and released the routine run ${title}; its results may now be reported.`,
        },
        superseded: {
          message: `${actor.name} replaced the run ${title} by a correction: ${comment ?? ''}`,
          subject: `Run replaced by a correction: ${run.title}`,
          line: `${actor.name} replaced the released run ${title} by a correction run, for this reason:\n\n  ${comment ?? ''}`,
        },
      }[event];
      message = texts.message;
      for (const to of recipients) mails.push({ to, subject: texts.subject, lines: [texts.line, '', `Open it: ${link}`] });
    }
    await this.notifications.notify(
      recipients.map((user) => user.id),
      { kind: `run.${event}`, message, link: path },
      manager,
    );
    return this.mail.letterDelivery(mails);
  }
}
