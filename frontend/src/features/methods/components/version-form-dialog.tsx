import { Button, CloseButton, Dialog, Heading, Portal, Stack, Text, Textarea } from '@chakra-ui/react';
import { useState } from 'react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import {
  DEFAULT_ACCURACY_BETA,
  DEFAULT_ACCURACY_LAMBDA_PCT,
  DEFAULT_COVERAGE_FACTOR,
  DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT,
  type MethodDto,
  type MethodVersionDto,
} from '@meritline/shared';
import { newVersionFormSchema, useCreateVersion, versionFormSchema, type VersionFormValues } from '../api/create-version';
import { useUpdateVersion } from '../api/update-version';
import { toCriterionRows } from '../api/version-rules';
import { ChangeControlFields } from './change-control-fields';
import { CriteriaEditor } from './criteria-editor';
import { SettingsFields } from './settings-fields';

export interface VersionFormDialogProps {
  method: MethodDto;
  /** `new`: a new draft starting from `version`; `edit`: change the draft `version` itself. */
  mode: 'new' | 'edit';
  version: MethodVersionDto;
  triggerLabel: string;
  /** Analysts propose; quality managers and administrators decide. */
  proposal?: boolean;
}

export function VersionFormDialog({ method, mode, version, triggerLabel, proposal = false }: VersionFormDialogProps) {
  const [open, setOpen] = useState(false);
  const createVersion = useCreateVersion(method.id);
  const updateVersion = useUpdateVersion(version);
  const nextNumber = Math.max(...method.versions.map((v) => v.number)) + 1;
  const initialValues: VersionFormValues = {
    changeSummary: mode === 'edit' ? version.changeSummary : '',
    changeKind: mode === 'edit' ? (version.changeKind ?? '') : 'other',
    revalidationScope: mode === 'edit' ? (version.revalidationScope ?? []) : [],
    criteria: toCriterionRows(version.criteria),
    settings: {
      requiresQualityRelease: version.settings.requiresQualityRelease,
      checkTolerancePct: version.settings.checkTolerancePct,
      onePointMaxInterceptPct: version.settings.onePointMaxInterceptPct,
      accuracyBeta: version.settings.accuracyBeta ?? DEFAULT_ACCURACY_BETA,
      accuracyLambdaPct: version.settings.accuracyLambdaPct ?? DEFAULT_ACCURACY_LAMBDA_PCT,
      coverageFactor: version.settings.coverageFactor ?? DEFAULT_COVERAGE_FACTOR,
    },
    recoveryEquivalenceMarginPct: version.settings.recoveryEquivalenceMarginPct ?? DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT,
  };
  const recordsChange = mode === 'new' || version.changeKind !== null;
  const title = mode === 'edit' ? `Edit draft version ${version.number}` : `${proposal ? 'Propose' : 'Create'} version ${nextNumber}`;

  const submit = async (values: VersionFormValues) => {
    try {
      if (mode === 'edit') await updateVersion.mutateAsync(values);
      else await createVersion.mutateAsync(values);
    } catch (error) {
      if (isApiError(error) && error.status === 409) {
        setOpen(false);
        toaster.create({
          type: 'warning',
          title: 'Version not saved',
          description: 'Someone else changed this version, or it is no longer a draft. The page now shows the current state.',
        });
        return;
      }
      throw error;
    }
    setOpen(false);
    toaster.create({ type: 'success', title: mode === 'edit' ? `Version ${version.number} saved` : `Draft version ${nextNumber} created` });
  };

  return (
    <Dialog.Root open={open} onOpenChange={(e) => setOpen(e.open)} size="xl" scrollBehavior="inside">
      <Dialog.Trigger asChild>
        <Button size="sm" variant={mode === 'edit' ? 'outline' : 'solid'}>
          {triggerLabel}
        </Button>
      </Dialog.Trigger>
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content>
            <Dialog.Header>
              <Dialog.Title>{title}</Dialog.Title>
            </Dialog.Header>
            <Dialog.Body pb="6">
              <Dialog.Description mb="5" color="fg.muted">
                {mode === 'new'
                  ? `${method.name}. The new version starts as a draft with the criteria and settings of version ${version.number}; ${
                      proposal ? 'a quality manager decides whether it becomes active.' : 'activate it when it is ready.'
                    }`
                  : `${method.name}. Criteria and settings can change only while the version is a draft.`}
              </Dialog.Description>
              <Form
                initialValues={initialValues}
                validationSchema={mode === 'new' ? newVersionFormSchema : versionFormSchema}
                onSubmit={submit}
                submitLabel={mode === 'edit' ? 'Save the draft' : 'Create the draft'}
                secondaryAction={
                  <Dialog.ActionTrigger asChild>
                    <Button variant="outline">Cancel</Button>
                  </Dialog.ActionTrigger>
                }
              >
                <FormField name="changeSummary" label="What changes, and why" required>
                  {(field) => <Textarea {...field} value={String(field.value ?? '')} rows={2} autoresize />}
                </FormField>
                <ChangeControlFields recordsChange={recordsChange} />
                <Stack gap="2">
                  <Heading as="h3" size="sm">
                    Acceptance criteria
                  </Heading>
                  <Text fontSize="sm" color="fg.muted">
                    Each criterion names a figure of the study result and the limit it must meet. The verdict of a study passes only when
                    every criterion holds.
                  </Text>
                  <CriteriaEditor />
                </Stack>
                <Stack gap="2">
                  <Heading as="h3" size="sm">
                    Settings
                  </Heading>
                  <SettingsFields />
                </Stack>
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
