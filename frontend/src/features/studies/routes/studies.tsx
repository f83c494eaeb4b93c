import { PageHeader } from '@/components/page-header';

export default function ValidationStudiesPage() {
  return (
    <PageHeader
      section="Bench work"
      title="Validation studies"
      description="Plan a validation, enter the calibration standards and responses, and see linearity, LOD/LOQ, recovery and precision against the method's acceptance criteria."
    />
  );
}
