import { PageHeader } from '@/components/page-header';

export default function MethodsPage() {
  return (
    <PageHeader
      section="Quality"
      title="Methods"
      description="The analytical methods of the laboratory, their acceptance criteria and which version is released for routine use."
    />
  );
}
