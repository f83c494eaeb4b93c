/** What changed in a method version, recorded under change control. */
export const METHOD_CHANGE_KINDS = [
  'instrument',
  'column-or-consumable',
  'sample-preparation',
  'range',
  'calibration-model',
  'criteria',
  'other',
] as const;
export type MethodChangeKind = (typeof METHOD_CHANGE_KINDS)[number];

export const METHOD_CHANGE_KIND_LABELS: Record<MethodChangeKind, string> = {
  instrument: 'Instrument',
  'column-or-consumable': 'Column or consumable',
  'sample-preparation': 'Sample preparation',
  range: 'Working range',
  'calibration-model': 'Calibration model',
  criteria: 'Acceptance criteria',
  other: 'Other',
};

/** Families of figures a change may require to be shown again before the version is activated. */
export const REVALIDATION_FAMILIES = ['linearity', 'detection-limits', 'recovery', 'precision'] as const;
export type RevalidationFamily = (typeof REVALIDATION_FAMILIES)[number];

export const REVALIDATION_FAMILY_LABELS: Record<RevalidationFamily, string> = {
  linearity: 'Linearity',
  'detection-limits': 'Detection limits',
  recovery: 'Recovery',
  precision: 'Precision',
};

/** The result sections a study must hold to show a family again. */
export const REVALIDATION_FAMILY_SECTIONS: Record<RevalidationFamily, readonly ('calibration' | 'detection' | 'recovery' | 'precision')[]> =
  {
    linearity: ['calibration'],
    'detection-limits': ['detection'],
    recovery: ['recovery'],
    precision: ['precision'],
  };

/** Percentage points within which two versions' mean recoveries count as equivalent, unless the version sets its own. */
export const DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT = 5;

/** Shortest written justification accepted for approving a failed study or activating without coverage. */
export const MIN_JUSTIFICATION_LENGTH = 20;
