import { PageHeader } from '@/components/page-header';

export default function RoutineBatchesPage() {
  return (
    <PageHeader
      section="Bench work"
      title="Routine batches"
      description="Quantify the samples of a batch against a released method, with its calibration and control checks."
    />
  );
}
