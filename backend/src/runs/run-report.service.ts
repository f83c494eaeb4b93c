import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { createdFields, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { LabCertificateService } from '../reports/signing/lab-certificate.service.js';
import { storeIssued } from '../reports/signing/store-issued.js';
import { renderResultsReport, type ReportSignature } from './results-report.js';
import { RunReleaseService } from './run-release.service.js';
import { RunResultsReport } from './run-results-report.entity.js';
import { RunSignature } from './run-signature.entity.js';
import { RunsService, type RunFile } from './runs.service.js';

/** The signed results report of a released, accepted run: rendered, signed and stored the first time, the same bytes ever after. */
@Injectable()
export class RunReportService {
  private readonly logger = new Logger(RunReportService.name);

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
    private readonly runs: RunsService,
    private readonly release: RunReleaseService,
    private readonly audit: AuditService,
    private readonly certificate: LabCertificateService,
  ) {}

  signaturesOf(runId: string): Promise<ReportSignature[]> {
    return this.dataSource.getRepository(RunSignature).find({ where: { runId }, order: { signedAt: 'ASC' } });
  }

  async reportFile(runId: string, actor: AuthUser): Promise<RunFile> {
    const report = await this.issue(runId, actor);
    return { body: report.pdf, contentType: 'application/pdf', filename: `results-report-${report.id.slice(0, 8)}.pdf` };
  }

  private async issue(runId: string, actor: AuthUser): Promise<RunResultsReport> {
    await this.release.assertReportable(runId);
    const repo = this.dataSource.getRepository(RunResultsReport);
    const existing = await repo.findOneBy({ runId });
    if (existing) return existing;
    const run = await this.runs.findOne(runId);
    const reportId = randomUUID();
    const signedAt = new Date();
    const verifyUrl = `${this.config.publicUrl}/verify`;
    const unsigned = await renderResultsReport({
      run,
      laboratoryName: this.config.laboratoryName,
      verifyUrl,
      reportId,
      issuedAt: signedAt,
      signatures: await this.signaturesOf(runId),
    });
    const issued = await this.certificate.issue(
      unsigned,
      `Results of the routine run "${run.title}" (${run.method.name}, version ${run.versionNumber}), issued by ${this.config.laboratoryName}`,
      signedAt,
    );
    const report = repo.create({ id: reportId, runId, methodVersionId: run.methodVersionId, ...issued, signedAt });
    const stored = await storeIssued(
      this.dataSource,
      this.audit,
      RunResultsReport,
      report,
      {
        actor,
        action: 'run-report.issued',
        entity: 'run-results-report',
        entityId: report.id,
        changes: createdFields({
          runId: runId,
          sha256: report.sha256,
          sizeBytes: report.sizeBytes,
        }),
        reason: `Signed results report issued for the released run “${run.title}”.`,
      },
      () => repo.findOneBy({ runId }),
    );
    if (stored === report) this.logger.log(`Issued results report ${report.id} for run ${runId} (${report.sizeBytes} bytes).`);
    return stored;
  }
}
