import { Inject, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { execFileSync } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DataSource } from 'typeorm';
import {
  ENGINE_VERSION,
  runQualification,
  type QualificationInstallation,
  type QualificationRunDetailDto,
  type QualificationRunDto,
} from '@meritline/shared';
import { createdFields, AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { LabCertificateService } from '../reports/signing/lab-certificate.service.js';
import { storeIssued } from '../reports/signing/store-issued.js';
import { qualificationFileName, renderQualificationReport } from './qualification-report.document.js';
import { QualificationRun } from './qualification-run.entity.js';

const here = dirname(fileURLToPath(import.meta.url));
const PRODUCT_VERSION = (createRequire(import.meta.url)('../../package.json') as { version: string }).version;

/** The source revision: GIT_REVISION when the build recorded it, else the checkout the server runs from. */
function gitRevision(): string {
  if (process.env.GIT_REVISION) return process.env.GIT_REVISION.slice(0, 64);
  try {
    return execFileSync('git', ['rev-parse', 'HEAD'], {
      cwd: here,
      encoding: 'utf8',
      stdio: ['ignore', 'pipe', 'ignore'],
      timeout: 5000,
    }).trim();
  } catch {
    return 'not recorded (no GIT_REVISION and no git checkout)';
  }
}

const toDto = (run: QualificationRun): QualificationRunDto => ({
  id: run.id,
  ranAt: run.ranAt.toISOString(),
  ranByName: run.ranByName,
  installation: run.installation,
  total: run.total,
  passed: run.passed,
  failed: run.total - run.passed,
  allPassed: run.allPassed,
  minDigits: run.results.minDigits,
  sha256: run.sha256,
  sizeBytes: run.sizeBytes,
});

@Injectable()
export class QualificationService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
    private readonly audit: AuditService,
    private readonly certificate: LabCertificateService,
  ) {}

  /**
   * Runs the published checks through the engine build this server uses and stores the signed report. The list takes
   * milliseconds, so it runs in the request rather than in a worker thread.
   */
  async run(actor: AuthUser): Promise<QualificationRunDetailDto> {
    const ranAt = new Date();
    const summary = runQualification();
    const installation = await this.installation();
    const id = randomUUID();
    const unsigned = await renderQualificationReport({
      id,
      ranAt,
      ranByName: actor.name,
      installation,
      checks: summary.checks,
      passed: summary.passed,
      minDigits: summary.minDigits,
      verifyUrl: `${this.config.publicUrl}/verify`,
    });
    const issued = await this.certificate.issue(
      unsigned,
      `Self-qualification of the calculations: ${summary.passed} of ${summary.checks.length} published checks passed`,
      ranAt,
    );
    const run = this.dataSource.getRepository(QualificationRun).create({
      id,
      ranAt,
      ranById: actor.id,
      ranByName: actor.name,
      installation,
      total: summary.checks.length,
      passed: summary.passed,
      allPassed: summary.allPassed,
      results: { checks: summary.checks, minDigits: summary.minDigits },
      ...issued,
    });
    await storeIssued(this.dataSource, this.audit, QualificationRun, run, {
      actor,
      action: 'qualification.run',
      entity: 'qualification',
      entityId: run.id,
      changes: createdFields({
        checks: run.total,
        passed: run.passed,
        engineVersion: installation.engineVersion,
        reportSha256: run.sha256,
      }),
    });
    return { ...toDto(run), checks: summary.checks };
  }

  async list(): Promise<QualificationRunDto[]> {
    const runs = await this.dataSource.getRepository(QualificationRun).find({ order: { ranAt: 'DESC' }, take: 100 });
    return runs.map(toDto);
  }

  async report(id: string): Promise<{ fileName: string; pdf: Buffer }> {
    const run = await this.dataSource
      .getRepository(QualificationRun)
      .createQueryBuilder('q')
      .addSelect('q.pdf')
      .where('q.id = :id', { id })
      .getOne();
    if (!run) throw new NotFoundException('Self-qualification run not found.');
    return { fileName: qualificationFileName(run.id), pdf: run.pdf };
  }

  private async installation(): Promise<QualificationInstallation> {
    const type = this.dataSource.options.type;
    let databaseKind: string;
    if (type === 'postgres') {
      const [row] = await this.dataSource.query<{ server_version: string }[]>('SHOW server_version');
      databaseKind = `PostgreSQL ${row?.server_version ?? ''}`.trim();
    } else {
      const [row] = await this.dataSource.query<{ version: string }[]>('SELECT sqlite_version() AS version');
      databaseKind = `SQLite ${row?.version ?? ''}`.trim();
    }
    return {
      productVersion: PRODUCT_VERSION,
      engineVersion: ENGINE_VERSION,
      gitRevision: gitRevision(),
      nodeVersion: process.version,
      databaseKind,
      laboratoryName: this.config.laboratoryName,
    };
  }
}
