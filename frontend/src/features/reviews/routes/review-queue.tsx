import { PageHeader } from '@/components/page-header';

export default function ReviewQueuePage() {
  return (
    <PageHeader
      section="Second person review"
      title="Review queue"
      description="Studies and batches submitted by analysts and waiting for your check, oldest first."
    />
  );
}
