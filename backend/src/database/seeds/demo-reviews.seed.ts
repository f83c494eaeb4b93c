import type { EntityManager } from 'typeorm';
import { Role, type SignatureMeaning, type StudySection, type StudyStatus } from '@meritline/shared';
import { AuditService } from '../../audit/audit.service.js';
import { Notification } from '../../notifications/notification.entity.js';
import { contentHash } from '../../reviews/signatures.js';
import { StudyComment } from '../../reviews/study-comment.entity.js';
import { StudySignature } from '../../reviews/study-signature.entity.js';
import { ValidationStudy } from '../../studies/validation-study.entity.js';
import { User } from '../../users/user.entity.js';

const RETURN_COMMENT =
  'The lowest standard sits well off the line and pulls the intercept. Re-inject it or exclude it with a reason, then resubmit.';

/**
 * The review trail of the seeded submitted, returned and approved studies: signatures over their
 * current content, the status changes and comments, all recorded through the audit chain.
 */
export async function seedDemoReviews(manager: EntityManager) {
  const audit = new AuditService(manager.connection);
  const users = await manager.getRepository(User).find({ order: { email: 'ASC' } });
  const reviewer = users.find((user) => user.roles.includes(Role.Reviewer) && !user.roles.includes(Role.QualityManager));
  const qualityManager = users.find((user) => user.roles.includes(Role.QualityManager));
  if (!reviewer || !qualityManager) return;

  const studies = await manager.getRepository(ValidationStudy).find({ relations: { methodVersion: true }, order: { createdAt: 'ASC' } });
  for (const study of studies.filter((s) => ['submitted', 'returned', 'approved'].includes(s.status))) {
    const author = users.find((user) => user.id === study.authorId);
    if (!author || !study.result) continue;
    const trail = new Trail(manager, audit, study);

    await trail.sign(author, Role.Analyst, 'authored', 'Calibration, blanks and recovery complete; ready for a second check.');
    await trail.move(author, 'draft', 'submitted', 'study.submitted');
    if (study.status === 'submitted') {
      await trail.notify([reviewer.id, qualityManager.id], 'study.submitted', `${author.name} submitted “${study.title}” for review.`);
    }
    if (study.status === 'returned') {
      const thread = await trail.comment(reviewer, 'standards', RETURN_COMMENT);
      await trail.move(reviewer, 'submitted', 'returned', 'study.returned', RETURN_COMMENT);
      await trail.comment(author, 'standards', 'Re-injecting the lowest standard tomorrow morning.', thread.id);
      await trail.notify([author.id], 'study.returned', `${reviewer.name} returned “${study.title}”: ${RETURN_COMMENT}`);
    }
    if (study.status === 'approved') {
      const thread = await trail.comment(
        reviewer,
        'recovery',
        'Recovery at the low level is at the edge of the range; the method version accepts it.',
      );
      await trail.resolve(reviewer, thread);
      await trail.sign(reviewer, Role.Reviewer, 'reviewed-and-approved', 'All sections checked against the method version.');
      if (study.methodVersion.settings?.requiresQualityRelease) {
        await trail.move(reviewer, 'submitted', 'submitted', 'study.review-approved');
        await trail.sign(qualityManager, Role.QualityManager, 'released', null);
        await trail.move(qualityManager, 'submitted', 'approved', 'study.released');
      } else {
        await trail.move(reviewer, 'submitted', 'approved', 'study.approved');
      }
      await trail.notify([author.id], 'study.approved', `“${study.title}” is approved.`);
    }
    await manager.getRepository(ValidationStudy).update({ id: study.id }, trail.dates());
  }
}

class Trail {
  private submittedAt: Date | null = null;
  private approvedAt: Date | null = null;

  constructor(
    private readonly manager: EntityManager,
    private readonly audit: AuditService,
    private readonly study: ValidationStudy,
  ) {}

  dates() {
    return { submittedAt: this.submittedAt, approvedAt: this.approvedAt };
  }

  async sign(signer: User, role: Role, meaning: SignatureMeaning, comment: string | null) {
    const repo = this.manager.getRepository(StudySignature);
    const authored = meaning === 'authored';
    const signature = await repo.save(
      repo.create({
        studyId: this.study.id,
        signerId: signer.id,
        signerName: signer.name,
        signerRole: role,
        meaning,
        signedAt: new Date(),
        contentHash: contentHash(this.study),
        comment,
        dataSnapshot: authored ? this.study.data : null,
        resultSnapshot: authored ? this.study.result : null,
      }),
    );
    await this.audit.record(
      {
        actor: signer,
        action: `signature.${meaning}`,
        entity: 'study-signature',
        entityId: signature.id,
        changes: {
          studyId: { from: null, to: this.study.id },
          signerRole: { from: null, to: role },
          contentHash: { from: null, to: signature.contentHash },
        },
        reason: comment,
      },
      this.manager,
    );
  }

  async move(actor: User, from: StudyStatus, to: StudyStatus, action: string, reason: string | null = null) {
    const entry = await this.audit.record(
      { actor, action, entity: 'study', entityId: this.study.id, changes: { status: { from, to } }, reason },
      this.manager,
    );
    if (to === 'submitted' && from !== 'submitted') this.submittedAt = entry.at;
    if (to === 'approved') this.approvedAt = entry.at;
  }

  async comment(author: User, section: StudySection, body: string, threadId: string | null = null): Promise<StudyComment> {
    const repo = this.manager.getRepository(StudyComment);
    const comment = await repo.save(
      repo.create({ studyId: this.study.id, section, threadId, authorId: author.id, authorName: author.name, body, resolved: false }),
    );
    await this.audit.record(
      {
        actor: author,
        action: 'study-comment.created',
        entity: 'study-comment',
        entityId: comment.id,
        changes: { studyId: { from: null, to: this.study.id }, section: { from: null, to: section }, body: { from: null, to: body } },
      },
      this.manager,
    );
    return comment;
  }

  async resolve(actor: User, comment: StudyComment) {
    await this.manager.getRepository(StudyComment).update({ id: comment.id }, { resolved: true });
    await this.audit.record(
      {
        actor,
        action: 'study-comment.resolved',
        entity: 'study-comment',
        entityId: comment.id,
        changes: { resolved: { from: false, to: true } },
      },
      this.manager,
    );
  }

  async notify(userIds: string[], kind: string, message: string) {
    const repo = this.manager.getRepository(Notification);
    await repo.save(
      userIds.map((userId) =>
        repo.create({ userId, kind, message: message.slice(0, 300), link: `/studies/${this.study.id}`, readAt: null }),
      ),
    );
  }
}
