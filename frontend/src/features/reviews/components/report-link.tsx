import { Button } from '@chakra-ui/react';
import { useState } from 'react';
import { toaster } from '@/components/ui/toaster';
import { apiRequest, isApiError } from '@/lib/api-client';

/** The signed PDF report of an approved study, fetched with the session token and saved. */
export function ReportLink({ studyId, title }: { studyId: string; title: string }) {
  const [loading, setLoading] = useState(false);
  const download = async () => {
    setLoading(true);
    try {
      const pdf = await apiRequest<Blob>(`/studies/${encodeURIComponent(studyId)}/report`, { responseType: 'blob' });
      const url = URL.createObjectURL(pdf);
      const link = Object.assign(document.createElement('a'), { href: url, download: `${title.replace(/[^\w.-]+/g, '-')}.pdf` });
      link.click();
      URL.revokeObjectURL(url);
    } catch (error) {
      toaster.create({ type: 'error', title: 'The report could not be downloaded', description: isApiError(error) ? error.body.message : undefined });
    } finally {
      setLoading(false);
    }
  };
  return (
    <Button variant="outline" loading={loading} onClick={() => void download()}>
      Download the signed report
    </Button>
  );
}
