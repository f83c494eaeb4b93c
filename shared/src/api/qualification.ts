import type { QualificationCheckResult } from '../qualification/checks.js';

/** Where a self-qualification ran: enough to tell one installation and build from another. */
export interface QualificationInstallation {
  productVersion: string;
  engineVersion: string;
  gitRevision: string;
  nodeVersion: string;
  databaseKind: string;
  laboratoryName: string;
}

export interface QualificationRunDto {
  id: string;
  ranAt: string;
  ranByName: string;
  installation: QualificationInstallation;
  total: number;
  passed: number;
  failed: number;
  allPassed: boolean;
  minDigits: number | null;
  /** SHA-256 of the signed PDF, as the verify page computes it. */
  sha256: string;
  sizeBytes: number;
}

export interface QualificationRunDetailDto extends QualificationRunDto {
  checks: QualificationCheckResult[];
}
