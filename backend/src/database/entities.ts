import { AuditEntry } from '../audit/audit-entry.entity.js';
import { AuditReview } from '../audit-review/audit-review.entity.js';
import { OutboxMessage } from '../mail/outbox-message.entity.js';
import { MethodVersion } from '../methods/method-version.entity.js';
import { Method } from '../methods/method.entity.js';
import { Notification } from '../notifications/notification.entity.js';
import { QualificationRun } from '../qualification/qualification-run.entity.js';
import { ValidationReport } from '../reports/validation-report.entity.js';
import { ChangeAssessment } from '../comparisons/change-assessment.entity.js';
import { StudyComment } from '../reviews/study-comment.entity.js';
import { StudySignature } from '../reviews/study-signature.entity.js';
import { Run } from '../runs/run.entity.js';
import { RunSignature } from '../runs/run-signature.entity.js';
import { RunResultsReport } from '../runs/run-results-report.entity.js';
import { QcBaseline } from '../runs/qc-baseline.entity.js';
import { QcSignalNotice } from '../runs/qc-signal-notice.entity.js';
import { RunImportMapping } from '../runs/run-import-mapping.entity.js';
import { ValidationStudy } from '../studies/validation-study.entity.js';
import { AppSetting } from '../auth/app-setting.entity.js';
import { UserSession } from '../auth/user-session.entity.js';
import { User } from '../users/user.entity.js';
import { ReferenceMaterial } from '../reference-materials/reference-material.entity.js';
import { StandardPreparation } from '../preparations/standard-preparation.entity.js';

export const entities = [
  User,
  OutboxMessage,
  AuditEntry,
  Method,
  MethodVersion,
  ValidationStudy,
  StudySignature,
  StudyComment,
  Notification,
  ValidationReport,
  Run,
  RunSignature,
  ChangeAssessment,
  RunResultsReport,
  QcBaseline,
  QcSignalNotice,
  RunImportMapping,
  UserSession,
  AppSetting,
  ReferenceMaterial,
  StandardPreparation,
  AuditReview,
  QualificationRun,
];
