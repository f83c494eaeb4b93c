import { ConflictException, Inject, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { createHash, randomUUID } from 'node:crypto';
import { DataSource, In } from 'typeorm';
import type { EvaluationResult, StudyInput } from '@meritline/shared';
import { AuditEntry } from '../audit/audit-entry.entity.js';
import { AuditService, type AuditRecord } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { QualificationRun } from '../qualification/qualification-run.entity.js';
import { StudyComment } from '../reviews/study-comment.entity.js';
import { StudySignature } from '../reviews/study-signature.entity.js';
import { writeTransaction } from '../database/write-transaction.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { formatDateTime } from './pdf/index.js';
import type { ReportContent } from './report-content.js';
import { LabCertificateService } from './signing/lab-certificate.service.js';
import { renderValidationReport, reportFileName, REPORT_ID_INFO_KEY } from './validation-report.document.js';
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

export type ReportVerification =
  | {
      valid: true;
      studyId: string;
      studyTitle: string;
      reportId: string;
      methodName: string;
      methodVersion: number;
      signedAt: string;
      sha256: string;
    }
  | {
      valid: true;
      kind: 'self-qualification';
      qualificationId: string;
      signedAt: string;
      passed: number;
      total: number;
      sha256: string;
    }
  | { valid: false; reason: string };

/** The report id a PDF names in its information dictionary, written directly or as a reference to a string object. */
function claimedReportId(pdf: string): string | null {
  const direct = new RegExp(`/${REPORT_ID_INFO_KEY}\\s*\\(([0-9a-f-]{36})\\)`).exec(pdf);
  if (direct) return direct[1];
  const reference = new RegExp(`/${REPORT_ID_INFO_KEY}\\s+(\\d+)\\s+0\\s+R`).exec(pdf);
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
    const pdf = await this.certificate.sign(await renderValidationReport(content), {
      reason: `Method validation report of ${content.method.name}, version ${content.version.number}, issued by ${content.laboratoryName}`,
      location: content.laboratoryName,
      contactInfo: content.verifyUrl,
      signingTime: signedAt,
    });
    const report = this.dataSource.getRepository(ValidationReport).create({
      id: reportId,
      studyId: study.id,
      methodVersionId: study.methodVersionId,
      pdf,
      sha256: sha256(pdf),
      sizeBytes: pdf.length,
      signedAt,
    });
    try {
      await writeTransaction(this.dataSource, async (manager) => {
        await manager.getRepository(ValidationReport).insert(report);
        await this.audit.record(
          {
            actor: actor ?? SYSTEM_ACTOR,
            action: 'report.issued',
            entity: 'validation-report',
            entityId: report.id,
            changes: {
              studyId: { from: null, to: study.id },
              methodVersionId: { from: null, to: study.methodVersionId },
              sha256: { from: null, to: report.sha256 },
              sizeBytes: { from: null, to: report.sizeBytes },
            },
            reason: `Signed report issued for the approved study “${study.title}”.`,
          },
          manager,
        );
      });
    } catch (error) {
      const raced = await this.findReport(studyId);
      if (raced) return raced;
      throw error;
    }
    this.logger.log(`Issued report ${report.id} for study ${study.id} (${report.sizeBytes} bytes).`);
    return report;
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
      pdf: await renderValidationReport(content),
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
    const claimed = claimedReportId(file.toString('latin1'));
    const original = claimed ? await reports.findOne({ where: { id: claimed }, select: { id: true, signedAt: true } }) : null;
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
      manager.getRepository(AuditEntry).find({ where: { entityId: study.id, action: In(EXCLUSION_ACTIONS) }, order: { seq: 'ASC' } }),
    ]);
    const { method, ...version } = study.methodVersion;
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
    };
  }
}
