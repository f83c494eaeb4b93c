import { ReviewerRemarks } from '@/features/reviews/components/reviewer-remarks';
import { StudySubmitSlot } from '@/features/reviews/components/study-submit-slot';
import { StudyWizardPage } from '@/features/studies/routes/study-wizard';

export default function StudyWizardRoute() {
  return <StudyWizardPage SubmitSlot={StudySubmitSlot} RemarksSlot={ReviewerRemarks} />;
}
