import { PageHeader } from '@/components/page-header';

export default function VersionComparisonPage() {
  return (
    <PageHeader
      section="Quality"
      title="Version comparison"
      description="Two versions of a method side by side: changed parameters, acceptance criteria and validation results."
    />
  );
}
