import { SignDialog } from '@/features/reviews/components/sign-dialog';

// Invented records of the demo laboratory, shared by the component tests.

export const nitrateMethod = {
  id: 'm-1',
  name: 'Nitrate in drinking water by ion chromatography',
  analyte: 'Nitrate',
  matrix: 'Drinking water',
  technique: 'IC',
  xUnit: 'mg/L',
  yUnit: 'µS·min',
};

export const activeVersion = {
  id: 'mv-2',
  number: 2,
  status: 'active',
  criteria: [],
  settings: { requiresQualityRelease: false, checkTolerancePct: 10, onePointMaxInterceptPct: 5 },
};

/** The reviewer's approval dialog of a study, as the study page shows it. */
export function ApproveDialog({ studyId, lockVersion }: { studyId: string; lockVersion: number }) {
  return <SignDialog studyId={studyId} lockVersion={lockVersion} step="approve" />;
}
