import { UsersAndOutbox1764626400000 } from './1764626400000-users-and-outbox.js';
import { AuditTrail1764626500000 } from './1764626500000-audit-trail.js';
import { MethodsStudiesRuns1764626600000 } from './1764626600000-methods-studies-runs.js';
import { SignatureResultSnapshot1764630000000 } from './1764630000000-signature-result-snapshot.js';
import { SessionsAndPasswordReset1764640000000 } from './1764640000000-sessions-and-password-reset.js';
import { MethodChangeControl1764650000000 } from './1764650000000-method-change-control.js';
import { RunRelease1764660000000 } from './1764660000000-run-release.js';
import { ChangeAssessments1796430074365 } from './1796430074365-change-assessments.js';
import { ReferenceMaterialsAndPreparations1796428717951 } from './1796428717951-reference-materials-and-preparations.js';
import { SignatureMetaSnapshot1796428791270 } from './1796428791270-signature-meta-snapshot.js';
import { RunResultsReports1796428699593 } from './1796428699593-run-results-reports.js';
import { QcTrends1796429841749 } from './1796429841749-qc-trends.js';
import { RunImportMappings1796430502016 } from './1796430502016-run-import-mappings.js';
import { AuditReview1796428669934 } from './1796428669934-audit-review.js';
import { QualificationRuns1796428669935 } from './1796428669935-qualification-runs.js';
import { QcSignalMessage1796439558943 } from './1796439558943-qc-signal-message.js';
import { ListKeysetIndexes1796439581141 } from './1796439581141-list-keyset-indexes.js';

export const migrations = [
  UsersAndOutbox1764626400000,
  AuditTrail1764626500000,
  MethodsStudiesRuns1764626600000,
  SignatureResultSnapshot1764630000000,
  SessionsAndPasswordReset1764640000000,
  MethodChangeControl1764650000000,
  RunRelease1764660000000,
  ChangeAssessments1796430074365,
  ReferenceMaterialsAndPreparations1796428717951,
  SignatureMetaSnapshot1796428791270,
  RunResultsReports1796428699593,
  QcTrends1796429841749,
  RunImportMappings1796430502016,
  AuditReview1796428669934,
  QualificationRuns1796428669935,
  QcSignalMessage1796439558943,
  ListKeysetIndexes1796439581141,
];
