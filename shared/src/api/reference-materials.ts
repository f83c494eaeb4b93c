/** Request and response bodies of /api/reference-materials. Dates are calendar days, YYYY-MM-DD. */

export type ReferenceMaterialStatus = 'in-use' | 'expired' | 'withdrawn';

export const REFERENCE_MATERIAL_STATUS_LABELS: Record<ReferenceMaterialStatus, string> = {
  'in-use': 'In use',
  expired: 'Expired',
  withdrawn: 'Withdrawn',
};

/** A pure substance certified for purity (mass fraction), or a material certified for a content in a unit. */
export type CertifiedValueKind = 'purity' | 'content';
export const CERTIFIED_VALUE_KINDS: readonly CertifiedValueKind[] = ['purity', 'content'];
export const CERTIFIED_VALUE_KIND_LABELS: Record<CertifiedValueKind, string> = {
  purity: 'Purity (mass fraction)',
  content: 'Certified content',
};
export const PURITY_UNIT = 'g/g';

/** A material is announced this many days before it expires. */
export const EXPIRY_WARNING_DAYS = 30;
export const MAX_CERTIFICATE_BYTES = 10 * 1024 * 1024;

/** The material and its certified value, as the certificate names them. */
export interface CertifiedMaterial {
  name: string;
  analyte: string;
  supplier: string;
  lot: string;
  certificateNumber: string;
  valueKind: CertifiedValueKind;
  certifiedValue: number;
  unit: string;
}

export interface ReferenceMaterialFields extends CertifiedMaterial {
  /** Expanded uncertainty U with its coverage factor k, as printed on the certificate… */
  expandedUncertainty?: number | null;
  coverageFactor?: number | null;
  /** …or the standard uncertainty u when the certificate states that instead. */
  standardUncertainty?: number | null;
  receivedOn: string;
  openedOn?: string | null;
  expiresOn: string;
  storage?: string;
}

export type CreateReferenceMaterialRequest = ReferenceMaterialFields;
export type UpdateReferenceMaterialRequest = Partial<ReferenceMaterialFields> & { lockVersion: number };

export interface WithdrawReferenceMaterialRequest {
  reason: string;
  lockVersion: number;
}

export interface CertificateFileDto {
  fileName: string;
  sizeBytes: number;
  sha256: string;
  uploadedAt: string;
}

export interface ReferenceMaterialDto extends CertifiedMaterial {
  id: string;
  expandedUncertainty: number | null;
  coverageFactor: number | null;
  /** u as stated, or U/k. */
  standardUncertainty: number;
  receivedOn: string;
  openedOn: string | null;
  expiresOn: string;
  storage: string;
  status: ReferenceMaterialStatus;
  /** Whole days from today to the expiry date (negative once expired). */
  daysToExpiry: number;
  /** In use and expiring within EXPIRY_WARNING_DAYS days. */
  expiringSoon: boolean;
  withdrawnReason: string | null;
  withdrawnAt: string | null;
  certificate: CertificateFileDto | null;
  lockVersion: number;
  createdAt: string;
  updatedAt: string;
}

/** u from the certificate: the stated standard uncertainty, otherwise U/k. */
export function certifiedStandardUncertainty(
  material: Pick<ReferenceMaterialFields, 'expandedUncertainty' | 'coverageFactor' | 'standardUncertainty'>,
): number {
  if (material.standardUncertainty != null) return material.standardUncertainty;
  return (material.expandedUncertainty ?? 0) / (material.coverageFactor ?? 2);
}

/** Whole calendar days from `today` to `date` (both YYYY-MM-DD). */
export function daysBetween(today: string, date: string): number {
  return Math.round((Date.parse(`${date}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
}

/** The material may be used up to and including its expiry date. */
export function referenceMaterialStatus(material: { expiresOn: string; withdrawnAt: unknown }, today: string): ReferenceMaterialStatus {
  if (material.withdrawnAt) return 'withdrawn';
  return daysBetween(today, material.expiresOn) < 0 ? 'expired' : 'in-use';
}

export function todayIso(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10);
}
