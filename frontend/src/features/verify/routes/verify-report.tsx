import { PageHeader } from '@/components/page-header';

export default function VerifyReportPage() {
  return (
    <PageHeader
      section="Reports"
      title="Verify a report"
      description="Check that a signed Meritline report is authentic and has not been changed since it was signed."
    />
  );
}
