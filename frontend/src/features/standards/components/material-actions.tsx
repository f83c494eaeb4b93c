import { Button, FileUpload, HStack } from '@chakra-ui/react';
import { Role, hasAnyRole, type ReferenceMaterialDto } from '@meritline/shared';
import { FormDialog } from '@/components/form-dialog';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { useSession } from '@/lib/auth';
import { downloadCertificate, MAX_CERTIFICATE_MB, useUploadCertificate } from '../api/certificate';
import { useWithdrawReferenceMaterial, withdrawSchema } from '../api/withdraw-reference-material';
import { MaterialFormDialog } from './material-form-dialog';

export function useCanKeepRegister(): boolean {
  const { user } = useSession();
  return hasAnyRole(user?.roles ?? [], [Role.QualityManager, Role.Admin]);
}

export function MaterialActions({ material }: { material: ReferenceMaterialDto }) {
  const canKeep = useCanKeepRegister();
  const open = material.status !== 'withdrawn';
  return (
    <HStack gap="2" justify="flex-end" wrap="wrap" maxW="12rem" ms="auto">
      {material.certificate && (
        <Button
          size="xs"
          variant="ghost"
          aria-label={`Certificate of ${material.name}, lot ${material.lot}`}
          onClick={() => void downloadCertificate(material)}
        >
          Certificate
        </Button>
      )}
      {canKeep && open && (
        <>
          <CertificateUpload material={material} />
          <MaterialFormDialog material={material} />
          <WithdrawDialog material={material} />
        </>
      )}
    </HStack>
  );
}

function CertificateUpload({ material }: { material: ReferenceMaterialDto }) {
  const upload = useUploadCertificate();
  return (
    <FileUpload.Root
      accept={['application/pdf']}
      maxFiles={1}
      maxFileSize={MAX_CERTIFICATE_MB * 1024 * 1024}
      width="auto"
      onFileAccept={(details) => {
        const file = details.files[0];
        if (file)
          upload.mutate(
            { material, file },
            { onSuccess: () => toaster.create({ type: 'success', title: `Certificate of ${material.name} stored` }) },
          );
      }}
      onFileReject={() =>
        toaster.create({
          type: 'error',
          title: 'Not stored',
          description: `Choose the certificate as a PDF of at most ${MAX_CERTIFICATE_MB} MB.`,
        })
      }
    >
      <FileUpload.HiddenInput aria-label={`Upload the certificate of ${material.name}, lot ${material.lot}`} />
      <FileUpload.Trigger asChild>
        <Button size="xs" variant="outline" loading={upload.isPending}>
          {material.certificate ? 'Replace PDF' : 'Upload PDF'}
        </Button>
      </FileUpload.Trigger>
    </FileUpload.Root>
  );
}

function WithdrawDialog({ material }: { material: ReferenceMaterialDto }) {
  const withdraw = useWithdrawReferenceMaterial();
  return (
    <FormDialog
      role="alertdialog"
      trigger={
        <Button size="xs" variant="ghost" colorPalette="red" aria-label={`Withdraw ${material.name}, lot ${material.lot}`}>
          Withdraw
        </Button>
      }
      title={`Withdraw ${material.name}, lot ${material.lot}?`}
      description="No new standard can be prepared from it, and studies can no longer name preparations made from it. It stays in the register for the record; this cannot be undone."
      initialValues={{ reason: '' }}
      validationSchema={withdrawSchema}
      onSubmit={async ({ reason }) => {
        await withdraw.mutateAsync({ id: material.id, body: { reason, lockVersion: material.lockVersion } });
        toaster.create({ type: 'success', title: `${material.name}, lot ${material.lot}, withdrawn` });
      }}
      submitLabel="Withdraw"
      destructive
    >
      <FormField name="reason" label="Reason" required placeholder="Container damaged; contents possibly contaminated." />
    </FormDialog>
  );
}
