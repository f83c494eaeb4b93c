import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, Not } from 'typeorm';
import {
  CONTROL_RULE_LABELS,
  controlLimits,
  controlSignals,
  MIN_BASELINE_POINTS,
  QC_SERIES_LABELS,
  Role,
  RunReviewStatus,
  type ControlSignal,
  type PutQcBaselineRequest,
  type QcBaselineDto,
  type QcSeries,
  type QcTrendPoint,
  type QcTrendsDto,
  type QcTrendSignalDto,
  type RunResult,
} from '@meritline/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { unprocessable } from '../common/validation.js';
import { writeTransaction } from '../database/write-transaction.js';
import { MailService } from '../mail/mail.service.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { UsersService } from '../users/users.service.js';
import { QcBaseline } from './qc-baseline.entity.js';
import { QcSignalNotice } from './qc-signal-notice.entity.js';
import { Run } from './run.entity.js';

interface SeriesValue {
  item: string | null;
  value: number;
}

/** The values a run contributes to a series: one per check standard, QC sample or blank, or one per run. */
function valuesOf(run: Run, series: QcSeries): SeriesValue[] {
  const result = run.result as unknown as RunResult;
  switch (series) {
    case 'slope':
      return typeof result.calibration?.slope === 'number' ? [{ item: null, value: result.calibration.slope }] : [];
    case 'intercept':
      return typeof result.calibration?.intercept === 'number' ? [{ item: null, value: result.calibration.intercept }] : [];
    case 'check':
      return result.checks.map((c) => ({ item: c.id, value: c.recoveryPct }));
    case 'qc':
      return (result.qcSamples ?? []).map((q) => ({ item: q.id, value: q.recoveryPct }));
    case 'blank':
      return (result.blanks ?? []).map((b) => ({ item: b.id, value: b.found }));
  }
}

const DIRECTION_WORDS: Record<ControlSignal['direction'], string> = {
  above: 'above the mean',
  below: 'below the mean',
  rising: 'rising',
  falling: 'falling',
};

const toBaselineDto = (b: QcBaseline): QcBaselineDto => ({
  methodVersionId: b.methodVersionId,
  runIds: b.runIds,
  chosenBy: { id: b.chosenById, name: b.chosenByName },
  chosenAt: b.chosenAt.toISOString(),
  reason: b.reason,
  lockVersion: b.lockVersion,
});

/** Control charts across released runs: limits from a chosen baseline, run rules on the runs after it. */
@Injectable()
export class QcTrendsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly users: UsersService,
    private readonly mail: MailService,
  ) {}

  private async version(methodId: string, versionId: string | undefined): Promise<MethodVersion> {
    const versions = await this.dataSource
      .getRepository(MethodVersion)
      .find({ where: { methodId }, relations: { method: true }, order: { number: 'DESC' } });
    if (!versions.length) throw new NotFoundException('Method not found.');
    if (versionId) {
      const chosen = versions.find((v) => v.id === versionId);
      if (!chosen) {
        const message = 'This method version does not belong to the method.';
        throw unprocessable([{ field: 'versionId', code: 'not_of_method', message }], message);
      }
      return chosen;
    }
    return versions.find((v) => v.status === 'active') ?? versions[0];
  }

  /** Accepted runs of the version that were not replaced by a correction, oldest first. */
  private chartRuns(methodVersionId: string): Promise<Run[]> {
    return this.dataSource.getRepository(Run).find({
      where: { methodVersionId, status: 'accepted', reviewStatus: Not(RunReviewStatus.Superseded) },
      order: { createdAt: 'ASC', id: 'ASC' },
    });
  }

  async trends(methodId: string, series: QcSeries, versionId?: string): Promise<QcTrendsDto> {
    const version = await this.version(methodId, versionId);
    const chart = await this.chart(version, series);
    await this.notify(version, series, chart);
    return chart;
  }

  private async chart(version: MethodVersion, series: QcSeries): Promise<QcTrendsDto> {
    const baseline = await this.dataSource.getRepository(QcBaseline).findOneBy({ methodVersionId: version.id });
    const runs = await this.chartRuns(version.id);
    const inBaseline = new Set(baseline?.runIds ?? []);
    const lastBaseline = Math.max(-Infinity, ...runs.filter((r) => inBaseline.has(r.id)).map((r) => r.createdAt.getTime()));
    const points: QcTrendPoint[] = [];
    for (const run of runs) {
      const isBaseline = inBaseline.has(run.id);
      // Limits never judge the points they come from, nor runs from before the baseline ends.
      if (!isBaseline && baseline && run.createdAt.getTime() <= lastBaseline) continue;
      for (const v of valuesOf(run, series))
        points.push({
          runId: run.id,
          runTitle: run.title,
          createdAt: run.createdAt.toISOString(),
          item: v.item,
          value: v.value,
          baseline: isBaseline,
          signals: [],
        });
    }
    const limits = baseline ? controlLimits(points.filter((p) => p.baseline).map((p) => p.value)) : null;
    const { method } = version;
    const unit =
      series === 'slope'
        ? `${method.yUnit} per ${method.xUnit}`
        : series === 'intercept'
          ? method.yUnit
          : series === 'blank'
            ? method.xUnit
            : '%';
    const base = {
      methodId: method.id,
      methodName: method.name,
      methodVersionId: version.id,
      versionNumber: version.number,
      series,
      seriesLabel: QC_SERIES_LABELS[series],
      unit,
      baseline: baseline ? toBaselineDto(baseline) : null,
      points,
    };
    if (!limits) {
      const message = baseline
        ? `The baseline holds fewer than ${MIN_BASELINE_POINTS} values of this series, so no limits can be set; a quality manager can choose a larger baseline.`
        : 'No baseline has been chosen for this method version: a quality manager picks the released runs whose values set the control limits.';
      return { ...base, limits: null, signals: [], message };
    }
    const judged = points.filter((p) => !p.baseline);
    const signals: QcTrendSignalDto[] = controlSignals(
      judged.map((p) => p.value),
      limits,
    ).map((s) => {
      const at = judged[s.index];
      const where = at.item ? `${at.item} in run “${at.runTitle}”` : `run “${at.runTitle}”`;
      const message = `${QC_SERIES_LABELS[series]}: ${CONTROL_RULE_LABELS[s.rule]}, ${DIRECTION_WORDS[s.direction]}, at ${where}.`;
      at.signals.push(CONTROL_RULE_LABELS[s.rule]);
      return { rule: s.rule, message, runId: at.runId, runTitle: at.runTitle, item: at.item, createdAt: at.createdAt };
    });
    return { ...base, limits, signals, message: null };
  }

  /** Each signal is e-mailed once to the active quality managers; the notice row records what was sent and to whom. */
  private async notify(version: MethodVersion, series: QcSeries, chart: QcTrendsDto): Promise<void> {
    if (!chart.signals.length) return;
    const repo = this.dataSource.getRepository(QcSignalNotice);
    const keyOf = (s: QcTrendSignalDto) => `${s.runId}:${s.item ?? ''}`.slice(0, 200);
    const sent = await repo.find({ where: { methodVersionId: version.id, series }, select: { rule: true, pointKey: true } });
    const fresh = chart.signals.filter((s) => !sent.some((n) => n.rule === s.rule && n.pointKey === keyOf(s)));
    if (!fresh.length) return;
    const managers = await this.users.findActiveWithRole(Role.QualityManager);
    const link = this.mail.link(`/runs/control-chart?versionId=${version.id}&series=${series}`);
    const mails: { to: string[]; subject: string; text: string }[] = [];
    for (const signal of fresh) {
      const subject = `Control chart signal: ${version.method.name}, version ${version.number}`.slice(0, 300);
      const text = [
        'Hello,',
        '',
        signal.message,
        '',
        'Look into the method before more results are released, following the laboratory’s procedures.',
        `Open the chart: ${link}`,
        '',
        '— Meritline',
      ].join('\n');
      try {
        await writeTransaction(this.dataSource, (manager) =>
          manager.getRepository(QcSignalNotice).insert({
            methodVersionId: version.id,
            series,
            rule: signal.rule,
            pointKey: keyOf(signal),
            recipients: managers.map((m) => m.email),
            subject,
            body: text,
            message: signal.message.slice(0, 500),
            sentAt: new Date(),
          }),
        );
      } catch {
        continue; // Another request recorded (and sends) this signal.
      }
      mails.push({ to: managers.map((m) => m.email), subject, text });
    }
    for (const mail of mails) await this.mail.send(mail);
  }

  async putBaseline(methodVersionId: string, dto: PutQcBaselineRequest, actor: AuthUser): Promise<QcBaselineDto> {
    const version = await this.dataSource
      .getRepository(MethodVersion)
      .findOne({ where: { id: methodVersionId }, relations: { method: true } });
    if (!version) throw new NotFoundException('Method version not found.');
    const runIds = [...new Set(dto.runIds)];
    const runs = await this.dataSource.getRepository(Run).find({ where: { id: In(runIds) } });
    const refused = runIds.findIndex((id) => {
      const run = runs.find((r) => r.id === id);
      return !run || run.methodVersionId !== methodVersionId || run.reviewStatus !== RunReviewStatus.Released || run.status !== 'accepted';
    });
    if (refused >= 0) {
      const message = 'Every baseline run must be a released, accepted run of this method version.';
      throw unprocessable([{ field: `runIds[${dto.runIds.indexOf(runIds[refused])}]`, code: 'not_released', message }], message);
    }
    const repo = this.dataSource.getRepository(QcBaseline);
    const reason = dto.reason.trim();
    await writeTransaction(this.dataSource, async (manager) => {
      const current = await manager.getRepository(QcBaseline).findOneBy({ methodVersionId });
      if ((current?.lockVersion ?? undefined) !== dto.lockVersion)
        throw new ConflictException(
          current
            ? 'The baseline was changed since you loaded it; reload the chart and choose again.'
            : 'This version has no baseline yet; leave out the lock version to choose the first one.',
        );
      const chosenAt = new Date();
      if (current) {
        const result = await manager
          .createQueryBuilder()
          .update(QcBaseline)
          .set({ runIds, chosenById: actor.id, chosenByName: actor.name, chosenAt, reason, lockVersion: () => 'lock_version + 1' })
          .where('id = :id AND lock_version = :lockVersion', { id: current.id, lockVersion: current.lockVersion })
          .execute();
        if (result.affected !== 1)
          throw new ConflictException('Someone else changed the baseline at the same moment; reload and try again.');
      } else {
        await manager
          .getRepository(QcBaseline)
          .insert({ methodVersionId, runIds, chosenById: actor.id, chosenByName: actor.name, chosenAt, reason, lockVersion: 1 });
      }
      await this.audit.record(
        {
          actor,
          action: 'qc-baseline.chosen',
          entity: 'method-version',
          entityId: methodVersionId,
          changes: { qcBaselineRunIds: { from: current?.runIds ?? null, to: runIds } },
          reason,
        },
        manager,
      );
    });
    return toBaselineDto(await repo.findOneByOrFail({ methodVersionId }));
  }

  /** After a release: judge every series of the version again, so a new signal is e-mailed at once. */
  async afterRelease(methodVersionId: string): Promise<void> {
    const version = await this.dataSource
      .getRepository(MethodVersion)
      .findOne({ where: { id: methodVersionId }, relations: { method: true } });
    if (!version) return;
    for (const series of ['check', 'qc', 'blank', 'slope', 'intercept'] as const)
      await this.notify(version, series, await this.chart(version, series));
  }
}
