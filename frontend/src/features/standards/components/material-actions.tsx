import { Button, CloseButton, Dialog, FileUpload, HStack, Portal, Text } from '@chakra-ui/react';
import { Role, hasAnyRole, type ReferenceMaterialDto } from '@meritline/shared';
import { useState } from 'react';
import { Form } from '@/components/form/form';
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
  const [open, setOpen] = useState(false);
  const withdraw = useWithdrawReferenceMaterial();
  return (
    <Dialog.Root open={open} onOpenChange={(e) => setOpen(e.open)} role="alertdialog" size="md">
      <Dialog.Trigger asChild>
        <Button size="xs" variant="ghost" colorPalette="red" aria-label={`Withdraw ${material.name}, lot ${material.lot}`}>
          Withdraw
        </Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>
                Withdraw {material.name}, lot {material.lot}?
              </Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb="6">
              <Text mb="4">
                No new standard can be prepared from it, and studies can no longer name preparations made from it. It stays in the register
                for the record; this cannot be undone.
              </Text>
              <Form
                initialValues={{ reason: '' }}
                validationSchema={withdrawSchema}
                onSubmit={async ({ reason }) => {
                  await withdraw.mutateAsync({ id: material.id, body: { reason, lockVersion: material.lockVersion } });
                  setOpen(false);
                  toaster.create({ type: 'success', title: `${material.name}, lot ${material.lot}, withdrawn` });
                }}
                submitLabel="Withdraw"
                secondaryAction={
                  <Dialog.ActionTrigger asChild>
                    <Button variant="outline">Cancel</Button>
                  </Dialog.ActionTrigger>
                }
              >
                <FormField name="reason" label="Reason" required placeholder="Container damaged; contents possibly contaminated." />
              </Form>
            </Dialog.Body>
            <Dialog.CloseTrigger asChild>
              <CloseButton size="sm" />
            </Dialog.CloseTrigger>
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
