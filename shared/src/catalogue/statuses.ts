import type { StudySection, StudyStatus } from '../api/studies.js';

/** One word per study status, on every screen and in every document. */
export const STUDY_STATUS_LABELS: Record<StudyStatus, string> = {
  draft: 'Draft',
  submitted: 'Awaiting review',
  returned: 'Returned for changes',
  approved: 'Approved',
};

/** One word for the outcome of an acceptance criterion, on screen and in reports. */
export const CRITERION_OUTCOME_LABELS = {
  met: 'Meets',
  notMet: 'Does not meet',
} as const;

export const criterionOutcomeLabel = (pass: boolean) => (pass ? CRITERION_OUTCOME_LABELS.met : CRITERION_OUTCOME_LABELS.notMet);

/** The parts of a study a review comment can be about. */
export const STUDY_SECTION_LABELS: Record<StudySection, string> = {
  setup: 'Setup',
  standards: 'Standards',
  blanks: 'Blanks',
  recovery: 'Recovery',
  precision: 'Precision',
  results: 'Results',
  conclusion: 'Conclusion',
};
