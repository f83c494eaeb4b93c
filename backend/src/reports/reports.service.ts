import type { EvaluationResult, ReportVerification, StudyInput } from '@meritline/shared';
import { ConflictException, Inject, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash, randomUUID } from 'node:crypto';
import { DataSource, In } from 'typeorm';
import { AuditEntry } from '../audit/audit-entry.entity.js';
import { createdFields, AuditService, type AuditRecord } from '../audit/audit.service.js';
import { ChangeAssessment } from '../comparisons/change-assessment.entity.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { QualificationRun } from '../qualification/qualification-run.entity.js';
import { StudyComment } from '../reviews/study-comment.entity.js';
import { StudySignature } from '../reviews/study-signature.entity.js';
import { RESULTS_REPORT_ID_INFO_KEY } from '../runs/results-report.js';
import { RunResultsReport } from '../runs/run-results-report.entity.js';
import { Run } from '../runs/run.entity.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { formatDateTime } from './pdf/index.js';
import type { ReportContent } from './report-content.js';
import { StandardPreparation } from '../preparations/standard-preparation.entity.js';
import { LabCertificateService } from './signing/lab-certificate.service.js';
import { storeIssued } from './signing/store-issued.js';
import { reportFileName, REPORT_ID_INFO_KEY } from './validation-report.document.js';
import { WorkerPoolService } from '../workers/worker-pool.service.js';
import { ValidationReport } from './validation-report.entity.js';

export const EXCLUSION_ACTIONS = ['study.point-excluded', 'study.point-included'];

/** Who issues a report that nobody asked for by hand (e.g. right after an approval). */
const SYSTEM_ACTOR: AuditRecord['actor'] = { id: null, name: 'Meritline (report service)' };

export interface ReportFile {
  fileName: string;
  pdf: Buffer;
  /** False for a draft preview: unsigned and never stored. */
  signed: boolean;
}

/** The report id a PDF names in its information dictionary, written directly or as a reference to a string object. */
function claimedReportId(pdf: string, key = REPORT_ID_INFO_KEY): string | null {
  const direct = new RegExp(`/${key}\\s*\\(([0-9a-f-]{36})\\)`).exec(pdf);
  if (direct) return direct[1];
  const reference = new RegExp(`/${key}\\s+(\\d+)\\s+0\\s+R`).exec(pdf);
  return reference ? (new RegExp(`(?:^|\\s)${reference[1]}\\s+0\\s+obj\\s*\\(([0-9a-f-]{36})\\)`).exec(pdf)?.[1] ?? null) : null;
}

const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

@Injectable()
export class ReportsService {
  private readonly logger = new Logger(ReportsService.name);

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
    private readonly audit: AuditService,
    private readonly certificate: LabCertificateService,
    private readonly workers: WorkerPoolService,
  ) {}

  /**
   * The signed report of an approved study, rendered, signed and stored the first time and returned
   * as stored ever after. Safe to call twice or concurrently: one report per study.
   */
  async issueForStudy(studyId: string, actor: AuthUser | null = null): Promise<ValidationReport> {
    const existing = await this.findReport(studyId);
    if (existing) return existing;
    const study = await this.findStudy(studyId);
    if (study.status !== 'approved') {
      throw new ConflictException(`Only an approved study gets a signed report; this study is ${study.status}.`);
    }
    const reportId = randomUUID();
    const signedAt = new Date();
    const content = await this.contentOf(study, reportId, signedAt);
    const issued = await this.certificate.issue(
      await this.workers.renderReport(content),
      `Method validation report of ${content.method.name}, version ${content.version.number}, issued by ${content.laboratoryName}`,
      signedAt,
    );
    const report = this.dataSource
      .getRepository(ValidationReport)
      .create({ id: reportId, studyId: study.id, methodVersionId: study.methodVersionId, ...issued, signedAt });
    const stored = await storeIssued(
      this.dataSource,
      this.audit,
      ValidationReport,
      report,
      {
        actor: actor ?? SYSTEM_ACTOR,
        action: 'report.issued',
        entity: 'validation-report',
        entityId: report.id,
        changes: createdFields({
          studyId: study.id,
          methodVersionId: study.methodVersionId,
          sha256: report.sha256,
          sizeBytes: report.sizeBytes,
        }),
        reason: `Signed report issued for the approved study “${study.title}”.`,
      },
      () => this.findReport(studyId),
    );
    if (stored === report) this.logger.log(`Issued report ${report.id} for study ${study.id} (${report.sizeBytes} bytes).`);
    return stored;
  }

  /** The stored signed report of an approved study (issued now if it has none yet), else an unsigned draft preview. */
  async reportFile(studyId: string, actor: AuthUser): Promise<ReportFile> {
    const study = await this.findStudy(studyId);
    if (study.status === 'approved') {
      const report = await this.issueForStudy(studyId, actor);
      return {
        fileName: reportFileName(study.methodVersion.method.name, study.methodVersion.number, report.id, study.id),
        pdf: report.pdf,
        signed: true,
      };
    }
    const content = await this.contentOf(study, null, new Date());
    return {
      fileName: reportFileName(content.method.name, content.version.number, null, study.id),
      pdf: await this.workers.renderReport(content),
      signed: false,
    };
  }

  /** Is this file, byte for byte, a report this installation issued? */
  async verify(file: Buffer): Promise<ReportVerification> {
    if (file.subarray(0, 1024).indexOf('%PDF-') === -1) {
      return { valid: false, reason: 'The file is not a PDF document, so it cannot be a Meritline report.' };
    }
    const reports = this.dataSource.getRepository(ValidationReport);
    const report = await reports.findOne({
      where: { sha256: sha256(file) },
      select: { id: true, studyId: true, sha256: true, signedAt: true },
    });
    if (report) {
      const study = await this.findStudy(report.studyId);
      return {
        valid: true,
        kind: 'validation-report',
        studyId: study.id,
        studyTitle: study.title,
        reportId: report.id,
        methodName: study.methodVersion.method.name,
        methodVersion: study.methodVersion.number,
        signedAt: report.signedAt.toISOString(),
        sha256: report.sha256,
      };
    }
    const qualification = await this.dataSource.getRepository(QualificationRun).findOne({
      where: { sha256: sha256(file) },
      select: { id: true, ranAt: true, passed: true, total: true, sha256: true },
    });
    if (qualification) {
      return {
        valid: true,
        kind: 'self-qualification',
        qualificationId: qualification.id,
        signedAt: qualification.ranAt.toISOString(),
        passed: qualification.passed,
        total: qualification.total,
        sha256: qualification.sha256,
      };
    }
    const results = this.dataSource.getRepository(RunResultsReport);
    const resultsReport = await results.findOne({
      where: { sha256: sha256(file) },
      select: { id: true, runId: true, sha256: true, signedAt: true },
    });
    if (resultsReport) {
      const run = await this.dataSource
        .getRepository(Run)
        .findOneOrFail({ where: { id: resultsReport.runId }, relations: { methodVersion: { method: true } } });
      return {
        valid: true,
        kind: 'results-report',
        reportId: resultsReport.id,
        runId: run.id,
        runTitle: run.title,
        methodName: run.methodVersion.method.name,
        methodVersion: run.methodVersion.number,
        signedAt: resultsReport.signedAt.toISOString(),
        sha256: resultsReport.sha256,
      };
    }
    const assessment = await this.findAssessment({ sha256: sha256(file) });
    if (assessment) return assessment;
    const text = file.toString('latin1');
    const claimed = claimedReportId(text);
    const claimedResults = claimedReportId(text, RESULTS_REPORT_ID_INFO_KEY);
    const original = claimed
      ? ((await reports.findOne({ where: { id: claimed }, select: { id: true, signedAt: true } })) ??
        (await this.dataSource.getRepository(ChangeAssessment).findOne({ where: { id: claimed }, select: { id: true, signedAt: true } })))
      : claimedResults
        ? await results.findOne({ where: { id: claimedResults }, select: { id: true, signedAt: true } })
        : null;
    if (original) {
      return {
        valid: false,
        reason:
          `This file names report ${original.id}, signed on ${formatDateTime(original.signedAt)}, but its content differs from the report as issued: ` +
          'it has been changed since it was signed.',
      };
    }
    return {
      valid: false,
      reason:
        'This PDF does not match any report issued by this laboratory’s Meritline. It may have been changed after signing, or it was not issued here.',
    };
  }

  private async findAssessment(where: { sha256: string }): Promise<ReportVerification | null> {
    const assessment = await this.dataSource.getRepository(ChangeAssessment).findOne({
      where,
      select: { id: true, methodVersionId: true, comparedVersionId: true, toStudyId: true, signedAt: true, sha256: true },
    });
    if (!assessment) return null;
    const versions = await this.dataSource
      .getRepository(MethodVersion)
      .find({ where: { id: In([assessment.methodVersionId, assessment.comparedVersionId]) }, relations: { method: true } });
    const assessed = versions.find((v) => v.id === assessment.methodVersionId) as MethodVersion;
    const compared = versions.find((v) => v.id === assessment.comparedVersionId) as MethodVersion;
    return {
      valid: true,
      kind: 'change-assessment',
      studyId: assessment.toStudyId ?? '',
      studyTitle: `Change assessment of version ${assessed.number} against version ${compared.number}`,
      reportId: assessment.id,
      methodName: assessed.method.name,
      methodVersion: assessed.number,
      signedAt: assessment.signedAt.toISOString(),
      sha256: assessment.sha256,
    };
  }

  private findReport(studyId: string): Promise<ValidationReport | null> {
    return this.dataSource.getRepository(ValidationReport).findOneBy({ studyId });
  }

  private async findStudy(studyId: string): Promise<ValidationStudy> {
    const study = await this.dataSource
      .getRepository(ValidationStudy)
      .findOne({ where: { id: studyId }, relations: { methodVersion: { method: true } } });
    if (!study) throw new NotFoundException('Study not found.');
    return study;
  }

  private async contentOf(study: ValidationStudy, reportId: string | null, issuedAt: Date): Promise<ReportContent> {
    const manager = this.dataSource.manager;
    const [signatures, comments, exclusions] = await Promise.all([
      manager.getRepository(StudySignature).find({ where: { studyId: study.id }, order: { signedAt: 'ASC' } }),
      manager.getRepository(StudyComment).find({ where: { studyId: study.id }, order: { createdAt: 'ASC' } }),
      manager
        .getRepository(AuditEntry)
        .find({ where: { entity: 'study', entityId: study.id, action: In(EXCLUSION_ACTIONS) }, order: { seq: 'ASC' } }),
    ]);
    const { method, ...version } = study.methodVersion;
    const preparations = await this.preparationsOf(study.data);
    return {
      laboratoryName: this.config.laboratoryName,
      verifyUrl: `${this.config.publicUrl}/verify`,
      reportId,
      issuedAt,
      method: {
        name: method.name,
        analyte: method.analyte,
        matrix: method.matrix,
        technique: method.technique,
        xUnit: method.xUnit,
        yUnit: method.yUnit,
      },
      version: { number: version.number, changeSummary: version.changeSummary, criteria: version.criteria },
      study: {
        id: study.id,
        title: study.title,
        status: study.status,
        data: study.data as unknown as StudyInput,
        result: study.result as unknown as EvaluationResult | null,
        resultErrors: study.resultErrors,
        engineVersion: study.engineVersion,
        dataHash: study.dataHash,
        meta: study.meta ?? {},
        createdAt: study.createdAt,
        submittedAt: study.submittedAt,
        approvedAt: study.approvedAt,
      },
      signatures: signatures.map((s) => ({
        signerName: s.signerName,
        signerRole: s.signerRole,
        meaning: s.meaning,
        signedAt: s.signedAt,
        contentHash: s.contentHash,
        comment: s.comment,
        justification: s.justification,
      })),
      comments: comments.map((c) => ({
        id: c.id,
        threadId: c.threadId,
        section: c.section,
        authorName: c.authorName,
        body: c.body,
        resolved: c.resolved,
        createdAt: c.createdAt,
      })),
      exclusions: exclusions.map((e) => ({ at: e.at, actorName: e.actorName, action: e.action, changes: e.changes, reason: e.reason })),
      preparations,
    };
  }

  private async preparationsOf(data: Record<string, unknown>): Promise<ReportContent['preparations']> {
    const standards = Array.isArray(data.standards) ? (data.standards as { preparationId?: unknown }[]) : [];
    const byId = new Map<string, number[]>();
    standards.forEach((s, i) => {
      if (typeof s?.preparationId === 'string') byId.set(s.preparationId, [...(byId.get(s.preparationId) ?? []), i]);
    });
    if (!byId.size) return [];
    const found = await this.dataSource.manager
      .getRepository(StandardPreparation)
      .find({ where: { id: In([...byId.keys()]) }, relations: { material: true, createdBy: true } });
    const rank = [...byId.keys()];
    return found
      .sort((a, b) => rank.indexOf(a.id) - rank.indexOf(b.id))
      .map((p) => ({
        id: p.id,
        name: p.name,
        material: p.material
          ? {
              name: p.material.name,
              supplier: p.material.supplier,
              lot: p.material.lot,
              certificateNumber: p.material.certificateNumber,
              expiresOn: p.material.expiresOn,
            }
          : null,
        source: p.input.source,
        stock: { concentration: p.result.stock.concentration, u: p.result.stock.u, unit: p.result.stock.unit },
        steps: p.result.steps.map(({ concentration, u }) => ({ concentration, u })),
        standards: byId.get(p.id) ?? [],
        savedBy: p.createdBy.name,
        savedAt: p.createdAt,
      }));
  }
}
