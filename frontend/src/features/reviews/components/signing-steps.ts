import type { SigningAction } from '../api/sign-study';

export interface SignatureStep {
  action: SigningAction;
  /** What the signature means, in words, shown to the signer above the password. */
  meaning: string;
  title: string;
  triggerLabel: string;
  submitLabel: string;
  successTitle: string;
}

const submit: SignatureStep = {
  action: 'submit',
  meaning:
    'By signing you confirm that you performed this study and that its data and conclusion are complete and correct as entered. You submit it for review by a second person.',
  title: 'Submit the study for review',
  triggerLabel: 'Submit for review',
  submitLabel: 'Sign and submit',
  successTitle: 'Submitted for review',
};

/** The electronic signatures a study collects on its way to approval. */
export const SIGNING_STEPS = {
  submit,
  resubmit: { ...submit, triggerLabel: 'Resubmit for review' },
  approve: {
    action: 'approve',
    meaning: 'By signing you confirm you reviewed this study and approve its results.',
    title: 'Approve the study',
    triggerLabel: 'Approve',
    submitLabel: 'Sign and approve',
    successTitle: 'Study approved',
  },
  release: {
    action: 'approve',
    meaning: 'By signing you confirm, as quality manager, that the study was reviewed and you release it: it then counts as approved.',
    title: 'Release the study',
    triggerLabel: 'Release',
    submitLabel: 'Sign and release',
    successTitle: 'Study released and approved',
  },
} satisfies Record<string, SignatureStep>;

export type SignatureStepName = keyof typeof SIGNING_STEPS;

/** The author's signature: a returned study is resubmitted. */
export const submitStep = (status: string): SignatureStepName => (status === 'returned' ? 'resubmit' : 'submit');
