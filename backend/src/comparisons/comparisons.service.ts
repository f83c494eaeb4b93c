import { ConflictException, Inject, Injectable, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { randomUUID } from 'node:crypto';
import { DataSource, In } from 'typeorm';
import {
  CALIBRATION_MODEL_LABELS,
  compareResults,
  DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT,
  describeRequirement,
  figureComparisons,
  figureLabel,
  figureUnit,
  METHOD_CHANGE_KIND_LABELS,
  METHOD_VERSION_STATUS_LABELS,
  REVALIDATION_FAMILY_LABELS,
  VERSION_ASPECT_LABELS,
  WEIGHTING_LABELS,
  type ComparedVersion,
  type CriterionOp,
  type EvaluationResult,
  type FieldError,
  type MethodTrendPoint,
  type MethodTrendResponse,
  type Unavailable,
  type VersionChangeRow,
  type VersionComparisonResponse,
} from '@meritline/shared';
import { createdFields, AuditService } from '../audit/audit.service.js';
import { AuthService } from '../auth/auth.service.js';
import type { AuthUser } from '../common/decorators/current-user.decorator.js';
import { unprocessable } from '../common/validation.js';
import { appConfig, type AppConfigType } from '../config/app.config.js';
import { LabCertificateService } from '../reports/signing/lab-certificate.service.js';
import { storeIssued } from '../reports/signing/store-issued.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { Method } from '../methods/method.entity.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { CHANGE_ASSESSED, ChangeAssessment } from './change-assessment.entity.js';
import { renderChangeAssessment } from './change-assessment.document.js';
import type { CreateAssessmentDto } from './dto/assessment.dto.js';
import type { CompareVersionsQueryDto } from './dto/compare-query.dto.js';

export const WRONG_ASSESSMENT_PASSWORD = 'Password not correct; the change assessment was not signed.';

export interface AssessmentFile {
  id: string;
  fileName: string;
  pdf: Buffer;
}

type Side = { version: MethodVersion; study: ValidationStudy | null };

const methodRef = ({ id, name, xUnit, yUnit }: Method) => ({ id, name, xUnit, yUnit });

function comparedVersion({ version, study }: Side): ComparedVersion {
  return {
    versionId: version.id,
    number: version.number,
    status: version.status,
    createdAt: version.createdAt.toISOString(),
    studyId: study?.id ?? null,
    studyTitle: study?.title ?? null,
    studyStatus: study?.status ?? null,
    approvedAt: study?.approvedAt?.toISOString() ?? null,
  };
}

const yesNo = (value: boolean | undefined) => (value === undefined ? null : value ? 'Required' : 'Not required');
const percent = (value: number | undefined, prefix = '') => (value === undefined ? null : `${prefix}${value} %`);

function changeRows(from: Side, to: Side, xUnit: string): VersionChangeRow[] {
  const row = (aspect: string, a: string | null, b: string | null): VersionChangeRow => ({ aspect, from: a, to: b, changed: a !== b });
  const kind = (v: MethodVersion) => (v.changeKind ? METHOD_CHANGE_KIND_LABELS[v.changeKind] : 'First version');
  const scope = (v: MethodVersion) =>
    (v.revalidationScope ?? []).map((family) => REVALIDATION_FAMILY_LABELS[family]).join(', ') || 'Nothing';
  const data = (side: Side) =>
    side.study?.data as { model?: keyof typeof CALIBRATION_MODEL_LABELS; weighting?: keyof typeof WEIGHTING_LABELS } | undefined;
  const model = (side: Side) =>
    data(side)?.model ? CALIBRATION_MODEL_LABELS[data(side)?.model as keyof typeof CALIBRATION_MODEL_LABELS] : null;
  const weighting = (side: Side) =>
    data(side)?.weighting ? WEIGHTING_LABELS[data(side)?.weighting as keyof typeof WEIGHTING_LABELS] : null;
  const settings = (side: Side) => side.version.settings;
  const margin = (side: Side) => settings(side).recoveryEquivalenceMarginPct ?? DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT;
  const rows = [
    row(VERSION_ASPECT_LABELS.status, METHOD_VERSION_STATUS_LABELS[from.version.status], METHOD_VERSION_STATUS_LABELS[to.version.status]),
    row(VERSION_ASPECT_LABELS.changeKind, kind(from.version), kind(to.version)),
    row(VERSION_ASPECT_LABELS.changeSummary, from.version.changeSummary, to.version.changeSummary),
    row(VERSION_ASPECT_LABELS.revalidationScope, scope(from.version), scope(to.version)),
    row(VERSION_ASPECT_LABELS.study, from.study?.title ?? null, to.study?.title ?? null),
    row(VERSION_ASPECT_LABELS.instrument, from.study?.meta.instrument ?? null, to.study?.meta.instrument ?? null),
    row(VERSION_ASPECT_LABELS.model, model(from), model(to)),
    row(VERSION_ASPECT_LABELS.weighting, weighting(from), weighting(to)),
    row(
      VERSION_ASPECT_LABELS.requiresQualityRelease,
      yesNo(settings(from).requiresQualityRelease),
      yesNo(settings(to).requiresQualityRelease),
    ),
    row(
      VERSION_ASPECT_LABELS.checkTolerancePct,
      percent(settings(from).checkTolerancePct, '±'),
      percent(settings(to).checkTolerancePct, '±'),
    ),
    row(
      VERSION_ASPECT_LABELS.onePointMaxInterceptPct,
      percent(settings(from).onePointMaxInterceptPct),
      percent(settings(to).onePointMaxInterceptPct),
    ),
    row(VERSION_ASPECT_LABELS.recoveryEquivalenceMarginPct, `±${margin(from)} percentage points`, `±${margin(to)} percentage points`),
  ];
  const requirement = (v: MethodVersion, figure: string) => {
    const criterion = v.criteria.find((c) => c.figure === figure);
    return criterion ? describeRequirement(criterion.op as CriterionOp, criterion.value, figureUnit(figure, { x: xUnit })) : null;
  };
  const figures = [...new Set([...from.version.criteria, ...to.version.criteria].map((c) => c.figure))];
  for (const figure of figures) {
    rows.push(
      row(`${VERSION_ASPECT_LABELS.criterion}: ${figureLabel(figure)}`, requirement(from.version, figure), requirement(to.version, figure)),
    );
  }
  return rows;
}

const noStudy = (side: Side) => `Version ${side.version.number} has no approved validation study: its figures and the tests are missing.`;

@Injectable()
export class ComparisonsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(appConfig.KEY) private readonly config: AppConfigType,
    private readonly audit: AuditService,
    private readonly auth: AuthService,
    private readonly certificate: LabCertificateService,
  ) {}

  /** A quality manager's e-signature on the comparison of a version with an earlier one: a signed PDF stored against the newer version. */
  async assess(versionId: string, dto: CreateAssessmentDto, actor: AuthUser): Promise<AssessmentFile> {
    const version = await this.dataSource.getRepository(MethodVersion).findOneBy({ id: versionId });
    if (!version) throw new NotFoundException('Method version not found.');
    let compareWith = dto.compareWith;
    if (compareWith === undefined) {
      const previous = await this.dataSource
        .getRepository(MethodVersion)
        .findOne({ where: { methodId: version.methodId, number: version.number - 1 } });
      if (!previous) {
        const message = 'The first version of a method has no earlier version to be assessed against.';
        throw unprocessable([{ field: 'compareWith', code: 'no_earlier_version', message }], message);
      }
      compareWith = previous.id;
    }
    const comparison = await this.compare({ from: compareWith, to: versionId, margin: dto.margin }).catch((error: unknown) => {
      // The comparison names its fields from/to; here they are compareWith and the version in the path.
      const body = (error as { getResponse?: () => { errors?: { field: string }[] } }).getResponse?.();
      body?.errors?.forEach((e) => (e.field = e.field === 'from' || e.field === 'to' ? 'compareWith' : e.field));
      throw error;
    });
    if (dto.lockVersion !== version.lockVersion) {
      throw new ConflictException('Someone changed this version since you opened the comparison; reload it and sign again.');
    }
    if (!(await this.auth.verifyPassword(actor.id, dto.password))) {
      await this.audit.signatureRefused(actor, { entity: 'method-version', entityId: versionId, meaning: 'change assessed' });
      throw new UnauthorizedException(WRONG_ASSESSMENT_PASSWORD);
    }
    const id = randomUUID();
    const signedAt = new Date();
    const statement = dto.statement.trim();
    const unsigned = await renderChangeAssessment({
      laboratoryName: this.config.laboratoryName,
      verifyUrl: `${this.config.publicUrl}/verify`,
      assessmentId: id,
      signedAt,
      signerName: actor.name,
      statement,
      comparison,
    });
    const issued = await this.certificate.issue(
      unsigned,
      `Change assessment of ${comparison.method.name}, version ${comparison.to.number} against version ${comparison.from.number}`,
      signedAt,
    );
    const assessment = this.dataSource.getRepository(ChangeAssessment).create({
      id,
      methodVersionId: versionId,
      comparedVersionId: comparison.from.versionId,
      fromStudyId: comparison.from.studyId,
      toStudyId: comparison.to.studyId,
      signerId: actor.id,
      signerName: actor.name,
      meaning: CHANGE_ASSESSED,
      statement,
      ...issued,
      signedAt,
    });
    await storeIssued(this.dataSource, this.audit, ChangeAssessment, assessment, {
      actor,
      action: 'signature.change-assessed',
      entity: 'method-version',
      entityId: versionId,
      changes: createdFields({
        assessmentId: id,
        comparedVersionId: comparison.from.versionId,
        signatureMeaning: 'change assessed',
        sha256: issued.sha256,
      }),
      reason: statement,
    });
    const slug =
      comparison.method.name
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, '-')
        .replace(/^-+|-+$/g, '')
        .slice(0, 60) || 'method';
    return { id, fileName: `meritline-${slug}-v${comparison.to.number}-assessment-${id.slice(0, 8)}.pdf`, pdf: issued.pdf };
  }

  async compare(query: CompareVersionsQueryDto): Promise<VersionComparisonResponse> {
    const versions = await this.dataSource
      .getRepository(MethodVersion)
      .find({ where: { id: In([query.from, query.to]) }, relations: { method: true } });
    const fromVersion = versions.find((v) => v.id === query.from);
    const toVersion = versions.find((v) => v.id === query.to);
    const errors: FieldError[] = [];
    if (!fromVersion) errors.push({ field: 'from', code: 'not_found', message: 'No method version with this id.' });
    if (!toVersion) errors.push({ field: 'to', code: 'not_found', message: 'No method version with this id.' });
    if (fromVersion && toVersion && fromVersion.id === toVersion.id) {
      errors.push({ field: 'to', code: 'same_version', message: 'Pick two different versions to compare.' });
    } else if (fromVersion && toVersion && fromVersion.methodId !== toVersion.methodId) {
      errors.push({
        field: 'to',
        code: 'other_method',
        message: 'The two versions belong to different methods; compare versions of one method.',
      });
    }
    if (errors.length || !fromVersion || !toVersion) throw unprocessable(errors, 'These two versions cannot be compared.');

    const from: Side = { version: fromVersion, study: await this.pickStudy(fromVersion, query.fromStudy, 'fromStudy') };
    const to: Side = { version: toVersion, study: await this.pickStudy(toVersion, query.toStudy, 'toStudy') };
    const marginPct = query.margin ?? toVersion.settings.recoveryEquivalenceMarginPct ?? DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT;
    const a = (from.study?.result ?? null) as EvaluationResult | null;
    const b = (to.study?.result ?? null) as EvaluationResult | null;
    const method = fromVersion.method;
    const base = {
      method: methodRef(method),
      from: comparedVersion(from),
      to: comparedVersion(to),
      changes: changeRows(from, to, method.xUnit),
    };
    if (a && b) {
      const c = compareResults(a, b, { recoveryMarginPct: marginPct });
      return {
        ...base,
        alpha: c.alpha,
        recoveryMarginPct: c.recoveryMarginPct,
        figures: c.figures,
        tests: {
          slope: c.slope,
          intercept: c.intercept,
          residualSd: c.residualSd,
          repeatability: c.repeatability,
          intermediatePrecision: c.intermediatePrecision,
          recovery: c.recovery,
        },
        detection: c.detection,
        range: c.range,
        missing: [],
      };
    }
    const missing = [from, to].filter((side) => !side.study).map(noStudy);
    const unavailable: Unavailable = { available: false, reason: missing.join(' ') };
    return {
      ...base,
      alpha: (b ?? a)?.alpha ?? 0.05,
      recoveryMarginPct: marginPct,
      figures: figureComparisons(a, b),
      tests: {
        slope: unavailable,
        intercept: unavailable,
        residualSd: unavailable,
        repeatability: unavailable,
        intermediatePrecision: unavailable,
        recovery: { welch: unavailable, tost: unavailable, verdict: 'inconclusive' },
      },
      detection: [],
      range: unavailable,
      missing,
    };
  }

  async trend(methodId: string): Promise<MethodTrendResponse> {
    const method = await this.dataSource.getRepository(Method).findOne({ where: { id: methodId }, relations: { versions: true } });
    if (!method) throw new NotFoundException('Method not found.');
    const versions = [...method.versions].sort((p, q) => p.number - q.number);
    const points: MethodTrendPoint[] = [];
    for (const version of versions) {
      const study = await this.latestApproved(version.id);
      const result = (study?.result ?? null) as EvaluationResult | null;
      const loq = result ? quantitationLimit(result) : null;
      points.push({
        versionId: version.id,
        number: version.number,
        status: version.status,
        createdAt: version.createdAt.toISOString(),
        studyId: study?.id ?? null,
        approvedAt: study?.approvedAt?.toISOString() ?? null,
        slope: result?.calibration?.slope ?? null,
        slopeCi: result?.calibration?.ciSlope ?? null,
        loq: loq?.value ?? null,
        loqBasis: loq?.basis ?? null,
        rsdR: result?.precision?.rsdR ?? null,
        rsdI: result?.precision?.rsdI ?? null,
        meanRecoveryPct: result?.recovery?.overall.meanPct ?? null,
        meanRecoveryCi: result?.recovery?.overall.ci ?? null,
      });
    }
    return { method: methodRef(method), points };
  }

  private latestApproved(versionId: string): Promise<ValidationStudy | null> {
    return this.dataSource.getRepository(ValidationStudy).findOne({
      where: { methodVersionId: versionId, status: 'approved' },
      order: { approvedAt: 'DESC', createdAt: 'DESC' },
    });
  }

  private async pickStudy(version: MethodVersion, studyId: string | undefined, field: string): Promise<ValidationStudy | null> {
    if (studyId === undefined) return this.latestApproved(version.id);
    const study = await this.dataSource.getRepository(ValidationStudy).findOneBy({ id: studyId, methodVersionId: version.id });
    if (!study) throw unprocessable([{ field, code: 'not_found', message: `No study with this id on version ${version.number}.` }]);
    if (!study.result) {
      throw unprocessable([{ field, code: 'no_result', message: 'This study cannot be evaluated yet, so it has no figures to compare.' }]);
    }
    return study;
  }
}

const LOQ_APPROACHES = ['sdResidual', 'sdIntercept', 'blankSd'] as const;

/** The LOQ the unknowns were judged against where it has one, else the first approach that gives one. */
function quantitationLimit(result: EvaluationResult): { value: number; basis: string } | null {
  const detection = result.detection;
  if (!detection) return null;
  const basis = LOQ_APPROACHES.find((a) => a === detection.flagBasis && detection[a]) ?? LOQ_APPROACHES.find((a) => detection[a]);
  return basis ? { value: (detection[basis] as { loq: number }).loq, basis } : null;
}
