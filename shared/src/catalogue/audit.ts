import { ROLE_LABELS } from '../roles.js';
import { RUN_REVIEW_STATUS_LABELS, RUN_SIGNATURE_MEANING_LABELS } from '../run-status.js';
import { STUDY_SECTION_LABELS, STUDY_STATUS_LABELS } from './statuses.js';

/** Every action the audit trail records, in words: the trail screen, its exports and its PDF show only these. */
export const AUDIT_ACTION_LABELS: Record<string, string> = {
  'auth.signed-in': 'Signed in',
  'auth.signed-out': 'Signed out',
  'auth.sign-in-failed': 'Sign-in refused (wrong password or unknown account)',
  'auth.sign-in-locked': 'Sign-in locked after repeated failures',
  'auth.unlocked': 'Account unlocked',
  'auth.password-changed': 'Password changed',
  'auth.password-reset-requested': 'Password reset requested',
  'auth.password-reset-completed': 'Password reset completed',
  'auth.invitation-accepted': 'Invitation accepted',
  'user.invited': 'User invited',
  'user.updated': 'User account changed',
  'settings.session-updated': 'Idle sign-out setting changed',
  'method.created': 'Method created',
  'method-version.created': 'Method version created',
  'method-version.updated': 'Method version changed',
  'method-version.criteria-changed': 'Acceptance criteria changed',
  'method-version.activated': 'Method version activated',
  'method-version.activated-with-justification': 'Method version activated with a justification',
  'method-version.retired': 'Method version retired',
  'study.created': 'Study created',
  'study.imported': 'Study imported',
  'study.updated': 'Study changed',
  'study.deleted': 'Study deleted',
  'study.point-excluded': 'Point excluded from the calculation',
  'study.point-included': 'Point included again',
  'study.submitted': 'Study submitted for review',
  'study.returned': 'Study returned for changes',
  'study.review-approved': 'Study approved by the reviewer, awaiting release',
  'study.approved': 'Study approved',
  'study.released': 'Study released by quality',
  'study-comment.created': 'Review comment written',
  'study-comment.resolved': 'Review comment resolved',
  'study-comment.reopened': 'Review comment reopened',
  'signature.authored': 'Signed as author',
  'signature.reviewed-and-approved': 'Signed as reviewer (approved)',
  'signature.released': 'Signed as quality (released)',
  'signature.performed': 'Signed as the analyst who performed the run',
  'signature.reviewed-and-released': 'Signed as reviewer (released)',
  'signature.failed': 'Signature refused (wrong password)',
  'signature.locked': 'Signing locked after wrong passwords',
  'report.issued': 'Signed report issued',
  'run.created': 'Run recorded',
  'run.submitted': 'Run submitted for review',
  'run.returned': 'Run returned for changes',
  'run.released': 'Run reviewed and released',
  'run.superseded': 'Run replaced by a correction',
  'audit.reviewed': 'Audit trail marked as reviewed',
  'qualification.run': 'Self-qualification of the calculations run',
  'signature.change-assessed': 'Signed as quality manager: change assessed',
  'qc-baseline.chosen': 'Control-chart baseline chosen',
  'reference-material.created': 'Reference material registered',
  'reference-material.updated': 'Reference material changed',
  'reference-material.withdrawn': 'Reference material withdrawn',
  'reference-material.certificate-uploaded': 'Certificate of a reference material attached',
  'reference-material.expiry-notice-sent': 'Expiry notice of a reference material sent',
  'preparation.created': 'Standard preparation recorded',
  'run-import-mapping.saved': 'Column mapping of instrument exports saved',
  'run-report.issued': 'Signed results report issued',
  'study.reassigned': 'Draft given to another analyst',
};

/** Words for an action code; an unknown code is never printed as such. */
export function auditActionLabel(action: string): string {
  return AUDIT_ACTION_LABELS[action] ?? 'Other recorded event';
}

/** Words for the kind of record an entry concerns (the `entity` column). */
export const AUDIT_ENTITY_LABELS: Record<string, string> = {
  study: 'Validation study',
  'study-comment': 'Review comment',
  'study-signature': 'Study signature',
  'validation-report': 'Validation report',
  method: 'Method',
  'method-version': 'Method version',
  run: 'Routine run',
  user: 'User account',
  settings: 'Settings',
  'audit-review': 'Audit-trail review',
  qualification: 'Self-qualification',
  'reference-material': 'Reference material',
  preparation: 'Standard preparation',
  'run-results-report': 'Results report',
  'change-assessment': 'Change assessment',
};

export const auditEntityLabel = (entity: string) => AUDIT_ENTITY_LABELS[entity] ?? 'Other record';

/** The record kinds a reader can filter the trail by, in words. */
export const AUDIT_RECORD_KIND_LABELS = {
  study: 'Validation study',
  'method-version': 'Method version',
  run: 'Routine run',
  user: 'User account',
  report: 'Validation report',
} as const;

export const AUDIT_FIELD_LABELS: Record<string, string> = {
  status: 'Status',
  reviewStatus: 'Review status',
  title: 'Title',
  name: 'Name',
  email: 'E-mail address',
  roles: 'Roles',
  active: 'Account active',
  meaning: 'Meaning of the signature',
  signerRole: 'Signed in the role of',
  contentHash: 'Fingerprint of the signed content (SHA-256)',
  dataHash: 'Fingerprint of the study data (SHA-256)',
  sha256: 'Fingerprint of the file (SHA-256)',
  sizeBytes: 'File size (bytes)',
  justification: 'Justification',
  studyId: 'Study',
  methodVersionId: 'Method version',
  copiedFromId: 'Started from study',
  section: 'Section',
  body: 'Comment',
  resolved: 'Resolved',
  number: 'Version number',
  purpose: 'Purpose',
  changeSummary: 'Summary of the change',
  changeKind: 'Kind of change',
  revalidationScope: 'Revalidation needed for',
  criteria: 'Acceptance criteria',
  settings: 'Version settings',
  meta: 'Study details',
  model: 'Calibration',
  idleMinutes: 'Idle sign-out after (minutes)',
  periodFrom: 'Period from',
  periodTo: 'Period to',
  record: 'Record',
  lastSeq: 'Newest entry covered',
  entries: 'Entries covered',
  chainIntact: 'Chain intact',
  checks: 'Checks',
  passed: 'Checks passed',
  verdict: 'Verdict',
  reportSha256: 'Fingerprint of the report (SHA-256)',
};

/** Field words: the catalogue first, else the camel-case name spelled out (`copiedFromId` → "Copied from"). */
export function auditFieldLabel(field: string): string {
  const standard = /^standards\[(\d+)\]\.excluded$/.exec(field);
  if (standard) return `Standard ${Number(standard[1]) + 1} excluded`;
  const lowSpike = /^lowSpikes\.(spiked|blanks)\[(\d+)\]\.excluded$/.exec(field);
  if (lowSpike)
    return `${lowSpike[1] === 'spiked' ? 'Low-level spike' : 'Method blank (detection limit)'} ${Number(lowSpike[2]) + 1} excluded`;
  if (AUDIT_FIELD_LABELS[field]) return AUDIT_FIELD_LABELS[field];
  const words = field
    .replace(/\[(\d+)\]/g, ' $1 ')
    .replace(/Id$/, '')
    .replace(/[._-]+/g, ' ')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .trim()
    .toLowerCase();
  return words ? words[0].toUpperCase() + words.slice(1) : 'Field';
}

const SIGNATURE_MEANING_WORDS: Record<string, string> = {
  ...RUN_SIGNATURE_MEANING_LABELS,
  authored: 'Authored',
  'reviewed-and-approved': 'Reviewed and approved',
  released: 'Released',
};

/** Coded values in words, per field: the same code can mean different things (a study's and a run's "submitted"). */
const VALUE_WORDS: Record<string, Record<string, string>> = {
  // Studies, method versions and the check-standard verdict of a run share the field name; their codes do not clash.
  status: { ...STUDY_STATUS_LABELS, active: 'Active', retired: 'Retired', accepted: 'Accepted', rejected: 'Rejected' },
  model: {
    linear: 'Straight line',
    'linear-through-origin': 'Straight line through the origin',
    quadratic: 'Quadratic curve',
    'one-point': 'One point (single standard level)',
    'two-point': 'Two points',
  },
  reviewStatus: RUN_REVIEW_STATUS_LABELS,
  meaning: SIGNATURE_MEANING_WORDS,
  roles: ROLE_LABELS,
  signerRole: ROLE_LABELS,
  section: STUDY_SECTION_LABELS,
};

const NO_VALUE = '—';
const MAX_VALUE_TEXT = 400;

/** A stored value in plain words: statuses and roles by their labels, yes/no, lists joined, nested fields spelled out. */
export function auditValueText(value: unknown, field = ''): string {
  const text = valueText(value, VALUE_WORDS[field] ?? {});
  return text.length > MAX_VALUE_TEXT ? `${text.slice(0, MAX_VALUE_TEXT - 1)}…` : text;
}

function valueText(value: unknown, words: Record<string, string>): string {
  if (value === null || value === undefined || value === '') return NO_VALUE;
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (typeof value === 'number') return String(value);
  if (typeof value === 'string') return words[value] ?? value;
  if (Array.isArray(value)) return value.length ? value.map((v) => valueText(v, words)).join(', ') : NO_VALUE;
  if (typeof value === 'object') {
    const parts = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .map(([k, v]) => `${auditFieldLabel(k)}: ${valueText(v, VALUE_WORDS[k] ?? {})}`);
    return parts.length ? parts.join('; ') : NO_VALUE;
  }
  return NO_VALUE;
}

/** Stored changes as rows of words. */
export function auditChangesInWords(
  changes: Record<string, { from: unknown; to: unknown }> | null | undefined,
  /** Printable names of the records that values refer to by id (a study's title for its id). */
  names: Record<string, string> = {},
): { field: string; from: string; to: string }[] {
  const text = (value: unknown, field: string) => (typeof value === 'string' && names[value] ? names[value] : auditValueText(value, field));
  return Object.entries(changes ?? {}).map(([field, change]) => ({
    field: auditFieldLabel(field),
    from: text(change?.from, field),
    to: text(change?.to, field),
  }));
}

/** What a break found by the chain check means for the reader, beside the finding itself. */
export function auditBreakMeaning(reason: string): string {
  if (/content does not match/.test(reason)) return 'This entry was changed after it was written.';
  if (/link to the previous entry/.test(reason)) return 'An entry just before this one was changed, removed or put in afterwards.';
  if (/is missing/.test(reason)) return 'An entry was removed from the trail.';
  if (/entries removed/.test(reason)) return 'The newest entries were removed after the last signed checkpoint.';
  if (/signed checkpoint/.test(reason)) return 'The trail up to this entry was rewritten after the checkpoint was signed.';
  if (/checkpoint file/.test(reason)) return 'The file of signed checkpoints was tampered with.';
  return 'The trail does not match what was recorded; ask your administrator to investigate.';
}
