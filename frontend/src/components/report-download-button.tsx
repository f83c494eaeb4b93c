import { Button, type ButtonProps } from '@chakra-ui/react';
import type { StudyStatus } from '@meritline/shared';
import { useState } from 'react';
import { toaster } from '@/components/ui/toaster';
import { api, isApiError } from '@/lib/api-client';
import { saveFile } from '@/lib/save-file';

export interface ReportDownloadButtonProps extends Omit<ButtonProps, 'onClick' | 'children'> {
  studyId: string;
  status: StudyStatus;
}

/** The signed report of an approved study, or an unsigned draft preview before approval, fetched with the session token and saved. */
export function ReportDownloadButton({ studyId, status, ...buttonProps }: ReportDownloadButtonProps) {
  const [loading, setLoading] = useState(false);
  const approved = status === 'approved';

  const download = async () => {
    setLoading(true);
    try {
      const pdf = await api.download(`/studies/${encodeURIComponent(studyId)}/report`);
      saveFile(pdf, `meritline-study-${studyId.slice(0, 8)}${approved ? '' : '-draft'}.pdf`);
    } catch (error) {
      toaster.create({
        type: 'error',
        title: approved ? 'The signed report could not be downloaded' : 'The draft preview could not be made',
        description: isApiError(error) ? error.body.message : undefined,
      });
    } finally {
      setLoading(false);
    }
  };

  return (
    <Button
      variant={approved ? 'solid' : 'outline'}
      loading={loading}
      loadingText={approved ? 'Preparing the report' : 'Preparing the preview'}
      onClick={() => void download()}
      {...buttonProps}
    >
      {approved ? 'Download signed report' : 'Preview draft report'}
    </Button>
  );
}
