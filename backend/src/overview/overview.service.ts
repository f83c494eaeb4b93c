import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, IsNull, MoreThan, Not } from 'typeorm';
import { hasAnyRole, Role, RunReviewStatus, type OverviewDto } from '@meritline/shared';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { StudySignature } from '../reviews/study-signature.entity.js';
import { QcSignalNotice } from '../runs/qc-signal-notice.entity.js';
import { Run } from '../runs/run.entity.js';

const LIMIT = 10;

@Injectable()
export class OverviewService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async overviewFor(user: AuthUser): Promise<OverviewDto> {
    const quality = user.roles.includes(Role.QualityManager);
    const [returnedRuns, versionsAwaitingActivation, justifiedApprovals, driftSignals] = await Promise.all([
      user.roles.includes(Role.Analyst) ? this.returnedRuns(user) : [],
      hasAnyRole(user.roles, [Role.QualityManager, Role.Admin]) ? this.draftVersions() : [],
      quality ? this.justifiedApprovals() : [],
      quality ? this.driftSignals() : [],
    ]);
    return { returnedRuns, versionsAwaitingActivation, justifiedApprovals, driftSignals };
  }

  private async returnedRuns(user: AuthUser): Promise<OverviewDto['returnedRuns']> {
    const runs = await this.dataSource.getRepository(Run).find({
      where: { authorId: user.id, reviewStatus: RunReviewStatus.Returned },
      order: { submittedAt: 'DESC' },
      take: LIMIT,
    });
    return runs.map((run) => ({
      id: run.id,
      title: run.title,
      comment: run.returnComment,
      submittedAt: run.submittedAt?.toISOString() ?? null,
    }));
  }

  /** The signals as they were e-mailed, in the notice's own sentence. */
  private async driftSignals(): Promise<OverviewDto['driftSignals']> {
    const since = new Date(Date.now() - 30 * 24 * 3600 * 1000);
    const notices = await this.dataSource.getRepository(QcSignalNotice).find({
      where: { sentAt: MoreThan(since) },
      order: { sentAt: 'DESC' },
      take: LIMIT,
    });
    const versions = await this.dataSource.getRepository(MethodVersion).find({
      where: notices.map((n) => ({ id: n.methodVersionId })),
      relations: { method: true },
    });
    return notices.flatMap((notice) => {
      const version = versions.find((v) => v.id === notice.methodVersionId);
      if (!version) return [];
      return [
        {
          id: notice.id,
          methodVersionId: version.id,
          methodName: version.method.name,
          versionNumber: version.number,
          series: notice.series,
          message: notice.message ?? notice.subject,
          at: notice.sentAt.toISOString(),
        },
      ];
    });
  }

  private async draftVersions(): Promise<OverviewDto['versionsAwaitingActivation']> {
    const versions = await this.dataSource.getRepository(MethodVersion).find({
      where: { status: 'draft' },
      relations: { method: true },
      order: { createdAt: 'ASC' },
      take: LIMIT,
    });
    return versions.map((v) => ({
      methodId: v.methodId,
      methodName: v.method.name,
      versionId: v.id,
      number: v.number,
      createdAt: v.createdAt.toISOString(),
    }));
  }

  private async justifiedApprovals(): Promise<OverviewDto['justifiedApprovals']> {
    const [signatures, versions] = await Promise.all([
      this.dataSource.getRepository(StudySignature).find({
        where: { justification: Not(IsNull()) },
        relations: { study: { methodVersion: true } },
        order: { signedAt: 'DESC' },
        take: LIMIT,
      }),
      this.dataSource.getRepository(MethodVersion).find({
        where: { activationJustification: Not(IsNull()) },
        relations: { method: true },
        order: { createdAt: 'DESC' },
        take: LIMIT,
      }),
    ]);
    return [
      ...signatures.map((s) => ({
        kind: 'study' as const,
        id: s.studyId,
        title: s.study.title,
        methodId: s.study.methodVersion.methodId,
        signerName: s.signerName,
        at: s.signedAt.toISOString(),
        justification: s.justification as string,
      })),
      ...versions.map((v) => ({
        kind: 'method-version' as const,
        id: v.id,
        title: `${v.method.name}, version ${v.number}`,
        methodId: v.methodId,
        signerName: null,
        at: null,
        justification: v.activationJustification as string,
      })),
    ];
  }
}
